import { eq } from 'drizzle-orm';
import { formatDate, formatMoney } from '../platform/format';
import type { DbOrTx } from '../platform/db/connect';
import { brief, payment, quote, user } from '../platform/db/schema';
import { appUrl } from '../platform/links';
import { enqueueMail } from '../platform/mail/outbox';

async function paymentWithQuote(db: DbOrTx, paymentId: string) {
  const [row] = await db
    .select({ payment, quote, brief, client: { name: user.name, email: user.email } })
    .from(payment)
    .innerJoin(quote, eq(quote.id, payment.quoteId))
    .innerJoin(brief, eq(brief.id, quote.briefId))
    .innerJoin(user, eq(user.id, brief.ownerId))
    .where(eq(payment.id, paymentId))
    .limit(1);
  return row ?? null;
}

/** Queues the client's receipt for a paid deposit in the transaction that records it; returns the queued ids. */
export async function queueReceipt(tx: DbOrTx, paymentId: string): Promise<string[]> {
  const row = await paymentWithQuote(tx, paymentId);
  if (!row) return [];
  const amount = formatMoney(row.payment.amountMinor, row.payment.currency);
  return enqueueMail(tx, [
    {
      kind: 'deposit-receipt',
      to: row.client.email,
      subject: `Receipt: deposit of ${amount} for quote ${row.quote.number}`,
      text: [
        `Dear ${row.client.name},`,
        '',
        `Thank you. We received your deposit for quote ${row.quote.number} (${row.brief.title}).`,
        '',
        `Amount paid:   ${amount}`,
        `Date:          ${formatDate(row.payment.paidAt ?? new Date())}`,
        `Reference:     ${row.payment.paymentIntentId ?? row.payment.checkoutSessionId}`,
        ...(row.quote.purchaseOrder ? [`Your PO:       ${row.quote.purchaseOrder}`] : []),
        `Quote total:   ${formatMoney(row.quote.totalMinor, row.quote.currency)}`,
        `Balance due:   ${formatMoney(row.quote.totalMinor - row.payment.amountMinor, row.quote.currency)} on delivery`,
        '',
        'Design work starts now; your engineer will keep you posted.',
        `The quote and its state: ${appUrl(`/quotes/${row.quote.id}`)}`,
        '',
        '— Railwright',
      ].join('\n'),
      relatedId: row.quote.id,
    },
  ]);
}

/** Queues the notice that a second payment for the same deposit was given back, with the refund's record. */
export async function queueRefundNotice(tx: DbOrTx, refundPaymentId: string): Promise<string[]> {
  const row = await paymentWithQuote(tx, refundPaymentId);
  if (!row) return [];
  const amount = formatMoney(row.payment.amountMinor, row.payment.currency);
  return enqueueMail(tx, [
    {
      kind: 'deposit-refund',
      to: row.client.email,
      subject: `Refund: ${amount} for quote ${row.quote.number}`,
      text: [
        `Dear ${row.client.name},`,
        '',
        `A payment of ${amount} for quote ${row.quote.number} (${row.brief.title}) could not count as its deposit —`,
        'the deposit had been paid already, or the acceptance had lapsed — so we have refunded it in full.',
        '',
        `Refund reference:  ${row.payment.checkoutSessionId}`,
        `Payment refunded:  ${row.payment.paymentIntentId ?? 'see the reference above'}`,
        '',
        'Your bank shows the refund within a few working days. Nothing else is needed from you.',
        `The quote and its state: ${appUrl(`/quotes/${row.quote.id}`)}`,
        '',
        '— Railwright',
      ].join('\n'),
      relatedId: row.quote.id,
    },
  ]);
}
