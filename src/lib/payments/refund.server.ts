/**
 * Money taken on a checkout that cannot count as its quote's deposit (the
 * deposit is paid already, or the acceptance lapsed) or as its balance (the
 * invoice is paid already) goes straight back through
 * the provider, and is recorded as a payment of kind `refund`.
 */
import { db } from '../platform/db';
import { payment, type PaymentRow } from '../platform/db/schema';
import { log } from '../platform/log';
import { movePayment } from './moves.server';
import { paymentProvider } from './provider.server';
import { queueRefundNotice } from './receipt.server';
import { deliverQueuedMail } from '../platform/mail/mailer';

/** Refunds the whole of one checkout's payment; the provider's idempotency key makes a repeat return the same refund. */
export async function refundUnappliedPayment(row: PaymentRow, paymentIntentId: string | null): Promise<PaymentRow | null> {
  if (!paymentIntentId) {
    log.error({ paymentId: row.id, session: row.checkoutSessionId }, 'a payment to refund carries no payment intent');
    return null;
  }
  const refund = await paymentProvider().refunds.create(
    {
      payment_intent: paymentIntentId,
      amount: row.amountMinor,
      reason: 'duplicate',
      metadata: { quoteId: row.quoteId, paymentId: row.id },
    },
    { idempotencyKey: `refund:${row.id}` },
  );
  const recorded = await db.transaction(async (tx) => {
    if (!(await movePayment(tx, row, 'refunded', { paymentIntentId }))) return null;
    const [inserted] = await tx
      .insert(payment)
      .values({
        quoteId: row.quoteId,
        kind: 'refund',
        // A refund has no checkout of its own: the provider's refund id is its reference.
        checkoutSessionId: refund.id,
        paymentIntentId,
        amountMinor: refund.amount,
        currency: row.currency,
        state: 'paid',
        paidAt: new Date(),
      })
      .onConflictDoNothing()
      .returning();
    // The client's notice is queued with the refund's record: both are kept, or neither.
    return inserted ? { row: inserted, queued: await queueRefundNotice(tx, inserted.id, row.kind) } : null;
  });
  if (!recorded) return null;
  await deliverQueuedMail(recorded.queued);
  return recorded.row;
}
