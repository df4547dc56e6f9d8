/** The one way a payment changes state: checked against the table, conditional on the state read. */
import { and, eq } from 'drizzle-orm';
import type { DbOrTx } from '../platform/db/connect';
import { payment, type PaymentRow, type PaymentState } from '../platform/db/schema';
import { canMovePayment } from './transitions';

/** The moved row, or null when the table forbids the move or another request moved it first. */
export async function movePayment(
  tx: DbOrTx,
  row: PaymentRow,
  to: PaymentState,
  extra: Partial<typeof payment.$inferInsert> = {},
): Promise<PaymentRow | null> {
  if (!canMovePayment(row.state, to)) return null;
  const [updated] = await tx
    .update(payment)
    .set({ state: to, updatedAt: new Date(), ...extra })
    .where(and(eq(payment.id, row.id), eq(payment.state, row.state)))
    .returning();
  return updated ?? null;
}
