/**
 * The one code path that applies a checkout the provider reports as paid, used
 * by the webhook and by the check the quote page and checkout make while a
 * payment is pending. Idempotent: it moves the payment only from the state it
 * read, and the database holds one paid deposit and one paid balance per quote.
 */
import { and, eq, ne } from 'drizzle-orm';
import { moveBrief } from '~/lib/briefs/index.server';
import { moveQuote } from '~/lib/quotes/index.server';
import { markInvoicePaid } from '~/lib/invoices/index.server';
import type { Transaction } from '../platform/db/connect';
import { brief, invoice, payment, quote, type PaymentRow } from '../platform/db/schema';
import { log } from '../platform/log';
import { matchesPayment, type SessionReport } from './event-checks';
import { movePayment } from './moves.server';
import { queueBalanceReceipt, queueReceipt } from './receipt.server';
import { deliverQueuedMail } from '../platform/mail/mailer';
import { refundUnappliedPayment } from './refund.server';

export type SettleResult =
  | { result: 'unknown-session' | 'not-paid' | 'amount-mismatch' | 'already-paid' | 'already-refunded' }
  /** `queued`: the receipt, queued in the same transaction. */
  | { result: 'deposit-paid' | 'balance-paid'; payment: PaymentRow; queued: string[] }
  /** Money taken that cannot count as the quote's deposit or balance: it is given back (refund.server.ts). */
  | { result: 'refund-due'; payment: PaymentRow; paymentIntentId: string | null };

/** Whether the quote has another paid payment of the same kind: then this one cannot count. */
async function anotherPaid(tx: Transaction, found: PaymentRow): Promise<boolean> {
  const [other] = await tx
    .select({ id: payment.id })
    .from(payment)
    .where(and(eq(payment.quoteId, found.quoteId), eq(payment.kind, found.kind), eq(payment.state, 'paid'), ne(payment.id, found.id)))
    .limit(1);
  return other !== undefined;
}

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
  if (found.kind === 'balance') return settleBalance(tx, found, report, now);

  const [quoteRow] = await tx.select().from(quote).where(eq(quote.id, found.quoteId)).limit(1);
  if (!quoteRow || (await anotherPaid(tx, found)) || quoteRow.state !== 'accepted') {
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

/**
 * A paid balance settles its quote's invoice and the brief is paid in full. A
 * second payment for an invoice already paid (a second tab, a late event) cannot
 * count and is given back.
 */
async function settleBalance(tx: Transaction, found: PaymentRow, report: SessionReport, now: Date): Promise<SettleResult> {
  const [invoiceRow] = await tx.select().from(invoice).where(eq(invoice.quoteId, found.quoteId)).limit(1);
  if (!invoiceRow || invoiceRow.state !== 'issued' || (await anotherPaid(tx, found))) {
    return { result: 'refund-due', payment: found, paymentIntentId: report.paymentIntentId };
  }
  const paid = await movePayment(tx, found, 'paid', { paidAt: now, paymentIntentId: report.paymentIntentId });
  if (!paid) return { result: 'already-paid' };
  if (await markInvoicePaid(tx, invoiceRow, now)) {
    const [quoteRow] = await tx.select({ briefId: quote.briefId }).from(quote).where(eq(quote.id, found.quoteId)).limit(1);
    const [briefRow] = quoteRow ? await tx.select().from(brief).where(eq(brief.id, quoteRow.briefId)).limit(1) : [];
    if (briefRow?.state === 'delivered')
      await moveBrief(tx, briefRow, 'paid-in-full', 'system', null, `Balance received: invoice ${invoiceRow.number}`);
  }
  return { result: 'balance-paid', payment: paid, queued: await queueBalanceReceipt(tx, paid.id) };
}

/** What follows a settled session once its transaction committed: the receipt, or the refund of money that cannot count. */
export async function afterSettle(settled: SettleResult): Promise<void> {
  if (settled.result === 'deposit-paid' || settled.result === 'balance-paid') await deliverQueuedMail(settled.queued);
  if (settled.result === 'refund-due') await refundUnappliedPayment(settled.payment, settled.paymentIntentId);
}
