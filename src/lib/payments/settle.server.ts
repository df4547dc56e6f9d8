/**
 * The one code path that applies a checkout the provider reports as paid, used
 * by the webhook and by the check the quote page and checkout make while a
 * deposit is pending. Idempotent: it moves the payment only from the state it
 * read, and the database holds one paid deposit per quote.
 */
import { and, eq, ne } from 'drizzle-orm';
import { moveBrief } from '~/lib/briefs/index.server';
import { moveQuote } from '~/lib/quotes/index.server';
import type { Transaction } from '../platform/db/connect';
import { brief, payment, quote, type PaymentRow } from '../platform/db/schema';
import { log } from '../platform/log';
import { matchesPayment, type SessionReport } from './event-checks';
import { movePayment } from './moves.server';
import { queueReceipt } from './receipt.server';
import { deliverQueuedMail } from '../platform/mail/mailer';
import { refundUnappliedPayment } from './refund.server';

export type SettleResult =
  | { result: 'unknown-session' | 'not-paid' | 'amount-mismatch' | 'already-paid' | 'already-refunded' }
  /** `queued`: the receipt, queued in the same transaction. */
  | { result: 'deposit-paid'; payment: PaymentRow; queued: string[] }
  /** Money taken that cannot count as the quote's deposit: it is given back (refund.server.ts). */
  | { result: 'refund-due'; payment: PaymentRow; paymentIntentId: string | null };

/** Applies a paid session inside the caller's transaction; the receipt or the refund follows it (afterSettle). */
export async function settlePaidSession(tx: Transaction, report: SessionReport, now = new Date()): Promise<SettleResult> {
  const [found] = await tx.select().from(payment).where(eq(payment.checkoutSessionId, report.id)).limit(1);
  if (!found) return { result: 'unknown-session' };
  if (!report.paid) return { result: 'not-paid' };
  // A figure other than the one we asked for is never applied; the webhook's outcome and the log keep it for staff.
  if (!matchesPayment(report, found)) {
    log.warn(
      {
        paymentId: found.id,
        session: report.id,
        stored: [found.amountMinor, found.currency],
        reported: [report.amountMinor, report.currency],
      },
      'a paid checkout reports another amount or currency than the stored payment; not applied',
    );
    return { result: 'amount-mismatch' };
  }
  if (found.state === 'paid') return { result: 'already-paid' };
  if (found.state === 'refunded') return { result: 'already-refunded' };

  const [quoteRow] = await tx.select().from(quote).where(eq(quote.id, found.quoteId)).limit(1);
  const [otherPaid] = await tx
    .select({ id: payment.id })
    .from(payment)
    .where(and(eq(payment.quoteId, found.quoteId), eq(payment.kind, 'deposit'), eq(payment.state, 'paid'), ne(payment.id, found.id)))
    .limit(1);
  if (!quoteRow || otherPaid || quoteRow.state !== 'accepted') {
    return { result: 'refund-due', payment: found, paymentIntentId: report.paymentIntentId };
  }

  const reference = report.paymentIntentId ?? report.id;
  const paid = await movePayment(tx, found, 'paid', { paidAt: now, paymentIntentId: report.paymentIntentId });
  if (!paid) return { result: 'already-paid' };
  if (await moveQuote(tx, quoteRow, 'deposit-paid', null, {}, `Payment ${reference}`, now)) {
    const [briefRow] = await tx.select().from(brief).where(eq(brief.id, quoteRow.briefId)).limit(1);
    if (briefRow?.state === 'accepted') await moveBrief(tx, briefRow, 'deposit-paid', 'system', null, 'Deposit received online');
  }
  return { result: 'deposit-paid', payment: paid, queued: await queueReceipt(tx, paid.id) };
}

/** What follows a settled session once its transaction committed: the receipt, or the refund of money that cannot count. */
export async function afterSettle(settled: SettleResult): Promise<void> {
  if (settled.result === 'deposit-paid') await deliverQueuedMail(settled.queued);
  if (settled.result === 'refund-due') await refundUnappliedPayment(settled.payment, settled.paymentIntentId);
}
