/**
 * Giving money back through the provider, recorded as a payment of kind
 * `refund` beside the payment it returns. Two ways in: money taken on a checkout
 * that cannot count (the deposit is paid already or the acceptance lapsed; the
 * invoice's balance is paid already) goes straight back on its own; and staff
 * refund a paid payment with a reason. Neither moves the quote or the brief: what
 * the work does next is a person's decision, and the refund's row keeps who and why.
 */
import { eq } from 'drizzle-orm';
import { db } from '../platform/db';
import { payment, type PaymentRow } from '../platform/db/schema';
import type { SignedInUser } from '../platform/http/guard';
import { log } from '../platform/log';
import { deliverQueuedMail } from '../platform/mail/mailer';
import { notYours, refuse, succeed, type Outcome } from '../platform/outcome';
import { movePayment } from './moves.server';
import { paymentProvider } from './provider.server';
import { queueRefundNotice } from './receipt.server';
import type { RefundRequest } from './refund-request';

interface RefundTerms {
  /** The provider's own word for why. */
  providerReason: 'duplicate' | 'requested_by_customer';
  /** The staff member who gave it back, and their reason; null when the product refunded on its own. */
  by: { id: string; reason: string } | null;
}

/** Refunds the whole of one payment; the provider's idempotency key makes a repeat return the same refund. */
async function refundWhole(row: PaymentRow, paymentIntentId: string, terms: RefundTerms): Promise<PaymentRow | null> {
  const refund = await paymentProvider().refunds.create(
    {
      payment_intent: paymentIntentId,
      amount: row.amountMinor,
      reason: terms.providerReason,
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
        refundOf: row.id,
        refundedBy: terms.by?.id ?? null,
        refundReason: terms.by?.reason ?? null,
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

/** Money a checkout took that cannot count as its quote's deposit goes straight back. */
export async function refundUnappliedPayment(row: PaymentRow, paymentIntentId: string | null): Promise<PaymentRow | null> {
  if (!paymentIntentId) {
    log.error({ paymentId: row.id, session: row.checkoutSessionId }, 'a payment to refund carries no payment intent');
    return null;
  }
  return refundWhole(row, paymentIntentId, { providerReason: 'duplicate', by: null });
}

/** Staff give back a paid deposit or balance in full, with their reason; the quote and the brief stay where they are. */
export async function refundPaidPayment(staff: SignedInUser, paymentId: string, request: RefundRequest): Promise<Outcome<PaymentRow>> {
  const [row] = await db.select().from(payment).where(eq(payment.id, paymentId)).limit(1);
  if (!row) return notYours();
  if (row.kind === 'refund') return refuse('wrong-state', 'This is a refund already; there is nothing to give back.');
  if (row.state === 'refunded') return refuse('wrong-state', 'This payment was refunded already.', { code: 'already_refunded' });
  if (row.state !== 'paid') return refuse('wrong-state', `This payment is ${row.state}: only a paid payment can be refunded.`);
  if (!row.paymentIntentId) {
    log.error({ paymentId: row.id }, 'a paid payment carries no payment intent');
    return refuse('unavailable', 'The provider’s reference for this payment is missing; refund it in the provider’s dashboard.');
  }
  const refunded = await refundWhole(row, row.paymentIntentId, {
    providerReason: 'requested_by_customer',
    by: { id: staff.id, reason: request.reason },
  });
  // Null: another request refunded it between our read and our move.
  return refunded ? succeed(refunded) : refuse('wrong-state', 'This payment was refunded already.', { code: 'already_refunded' });
}
