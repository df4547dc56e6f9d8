/** The one way a payment changes state: checked against the table, conditional on the state read. */
import { and, eq } from 'drizzle-orm';
import type { DbOrTx } from '../platform/db/connect';
import { payment, type PaymentRow, type PaymentStatus } from '../platform/db/schema';
import { canMovePayment } from './transitions';

/** The moved row, or null when the table forbids the move or another request moved it first. */
export async function movePayment(
  tx: DbOrTx,
  row: PaymentRow,
  to: PaymentStatus,
  extra: Partial<typeof payment.$inferInsert> = {},
): Promise<PaymentRow | null> {
  if (!canMovePayment(row.status, to)) return null;
  const [updated] = await tx
    .update(payment)
    .set({ status: to, updatedAt: new Date(), ...extra })
    .where(and(eq(payment.id, row.id), eq(payment.status, row.status)))
    .returning();
  return updated ?? null;
}
