import { eq } from 'drizzle-orm';
import { formatDate, formatMoney } from '../platform/format';
import { db } from '../platform/db';
import { brief, payment, quote, user } from '../platform/db/schema';
import { appUrl } from '../platform/links';
import { mailer } from '../platform/mail/mailer';

/** The client's receipt for a paid deposit; a failed send is logged in the mail log, the payment stands. */
export async function sendReceipt(paymentId: string): Promise<void> {
  const [row] = await db
    .select({ payment, quote, brief, client: { name: user.name, email: user.email } })
    .from(payment)
    .innerJoin(quote, eq(quote.id, payment.quoteId))
    .innerJoin(brief, eq(brief.id, quote.briefId))
    .innerJoin(user, eq(user.id, brief.ownerId))
    .where(eq(payment.id, paymentId))
    .limit(1);
  if (!row) return;
  const amount = formatMoney(row.payment.amountMinor, row.payment.currency);
  await mailer.send({
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
      `Quote total:   ${formatMoney(row.quote.totalMinor, row.quote.currency)}`,
      `Balance due:   ${formatMoney(row.quote.totalMinor - row.payment.amountMinor, row.quote.currency)} on delivery`,
      '',
      'Design work starts now; your engineer will keep you posted.',
      `The quote and its state: ${appUrl(`/quotes/${row.quote.id}`)}`,
      '',
      '— Railwright',
    ].join('\n'),
    relatedId: row.quote.id,
  });
}
