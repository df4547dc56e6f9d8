import { eq } from 'drizzle-orm';
import { formatDate, formatMoney } from '../platform/format';
import type { DbOrTx } from '../platform/db/connect';
import { brief, invoice, payment, quote, user, type PaymentKind } from '../platform/db/schema';
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

/** What the engineer's notice of a paid deposit or balance says next. */
const PAID_NEXT = {
  deposit: 'The design work can be scheduled: move the brief into design on its review page.',
  balance: 'The invoice is settled and the job is paid in full.',
} as const;

/** Tells the engineer who drafted the quote that its deposit arrived (the design work can be scheduled) or its balance (the job is paid in full). */
async function paidNotice(
  tx: DbOrTx,
  row: NonNullable<Awaited<ReturnType<typeof paymentWithQuote>>>,
  amount: string,
  what: 'deposit' | 'balance',
) {
  const [engineer] = await tx.select({ email: user.email }).from(user).where(eq(user.id, row.quote.createdBy)).limit(1);
  if (!engineer) return [];
  return [
    {
      kind: `${what}-paid`,
      to: engineer.email,
      subject: `${what === 'deposit' ? 'Deposit' : 'Balance'} paid: quote ${row.quote.number}, ${row.brief.title}`,
      text: [
        `${row.client.name} paid the ${what} of ${amount} for quote ${row.quote.number} (${row.brief.title}).`,
        ...(row.quote.purchaseOrder ? [`Their purchase order: ${row.quote.purchaseOrder}`] : []),
        PAID_NEXT[what],
        '',
        `The brief: ${appUrl(`/desk/briefs/${row.brief.id}`)}`,
      ].join('\n'),
      relatedId: row.quote.id,
    },
  ];
}

/** Queues the client's receipt for a paid deposit, and the engineer's notice, in the transaction that records it; returns the queued ids. */
export async function queueReceipt(tx: DbOrTx, paymentId: string): Promise<string[]> {
  const row = await paymentWithQuote(tx, paymentId);
  if (!row) return [];
  const amount = formatMoney(row.payment.amountMinor, row.payment.currency);
  return enqueueMail(tx, [
    ...(await paidNotice(tx, row, amount, 'deposit')),
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

/** Why a payment of this kind could not count, in the refund notice's words. */
const REFUND_REASON: Record<PaymentKind, readonly [string, string]> = {
  deposit: [
    'could not count as its deposit —',
    'the deposit had been paid already, or the acceptance had lapsed — so we have refunded it in full.',
  ],
  balance: ['could not count as its balance —', 'the invoice had been paid already — so we have refunded it in full.'],
  refund: ['could not be applied,', 'so we have refunded it in full.'],
};

/** Queues the client's receipt for the paid balance of an invoice, with their PO, and the engineer's notice, in the transaction that records it. */
export async function queueBalanceReceipt(tx: DbOrTx, paymentId: string): Promise<string[]> {
  const row = await paymentWithQuote(tx, paymentId);
  if (!row) return [];
  const [invoiceRow] = await tx.select().from(invoice).where(eq(invoice.quoteId, row.quote.id)).limit(1);
  if (!invoiceRow) return [];
  const money = (minor: number) => formatMoney(minor, row.payment.currency);
  return enqueueMail(tx, [
    ...(await paidNotice(tx, row, money(row.payment.amountMinor), 'balance')),
    {
      kind: 'balance-receipt',
      to: row.client.email,
      subject: `Receipt: balance of ${money(row.payment.amountMinor)} for invoice ${invoiceRow.number}`,
      text: [
        `Dear ${row.client.name},`,
        '',
        `Thank you. We received the balance of invoice ${invoiceRow.number} for quote ${row.quote.number} (${row.brief.title}).`,
        '',
        `Amount paid:   ${money(row.payment.amountMinor)}`,
        `Date:          ${formatDate(row.payment.paidAt ?? new Date())}`,
        `Reference:     ${row.payment.paymentIntentId ?? row.payment.checkoutSessionId}`,
        ...(invoiceRow.purchaseOrder ? [`Your PO:       ${invoiceRow.purchaseOrder}`] : []),
        `Invoice total: ${money(invoiceRow.grossMinor)}, of which ${money(invoiceRow.depositPaidMinor)} was paid as the deposit`,
        'Nothing more is due: the work is paid in full.',
        '',
        `The quote and its invoice: ${appUrl(`/quotes/${row.quote.id}`)}`,
        '',
        '— Railwright',
      ].join('\n'),
      relatedId: row.quote.id,
    },
  ]);
}

/**
 * Queues the client's notice that a payment was given back, with the refund's record: staff's
 * reason when staff gave it, else why a payment of that kind could not count (a second deposit or balance).
 */
export async function queueRefundNotice(tx: DbOrTx, refundPaymentId: string, refundedKind: PaymentKind): Promise<string[]> {
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
        ...(row.payment.refundReason
          ? [`We have refunded ${amount} for quote ${row.quote.number} (${row.brief.title}) in full.`, `Why: ${row.payment.refundReason}`]
          : [
              `A payment of ${amount} for quote ${row.quote.number} (${row.brief.title}) ${REFUND_REASON[refundedKind][0]}`,
              REFUND_REASON[refundedKind][1],
            ]),
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
