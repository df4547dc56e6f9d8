/** A quote's payments as the desk lists them: every kind and state, oldest first, with who refunded what and why. */
import { asc, eq } from 'drizzle-orm';
import { db } from '../platform/db';
import { payment, user, type PaymentRow } from '../platform/db/schema';

export interface PaymentEntry {
  row: PaymentRow;
  /** For a refund given by staff, their name (null when the product refunded it itself, or they are gone). */
  refundedByName: string | null;
}

export async function paymentsOfQuote(quoteId: string): Promise<PaymentEntry[]> {
  const rows = await db
    .select({ row: payment, refundedByName: user.name })
    .from(payment)
    .leftJoin(user, eq(user.id, payment.refundedBy))
    .where(eq(payment.quoteId, quoteId))
    .orderBy(asc(payment.createdAt), asc(payment.id));
  return rows;
}

/** Whether staff may give this payment back now: a paid deposit or balance. */
export const refundable = (row: Pick<PaymentRow, 'kind' | 'state'>) => row.kind !== 'refund' && row.state === 'paid';

export function paymentJson(row: PaymentRow) {
  return {
    id: row.id,
    quoteId: row.quoteId,
    kind: row.kind,
    state: row.state,
    amountMinor: row.amountMinor,
    currency: row.currency,
    paidAt: row.paidAt?.toISOString() ?? null,
    refundOf: row.refundOf,
    refundReason: row.refundReason,
  };
}
