import { and, desc, eq, inArray } from 'drizzle-orm';
import { db } from '../platform/db';
import { payment, type PaymentRow } from '../platform/db/schema';

export type { PaymentRow };

/** The paid deposit of a quote, if any, the latest attempt, and money given back: what the quote page tells. */
export async function depositState(
  quoteId: string,
): Promise<{ paid: PaymentRow | null; latest: PaymentRow | null; refunds: PaymentRow[] }> {
  const [paid] = await db
    .select()
    .from(payment)
    .where(and(eq(payment.quoteId, quoteId), eq(payment.kind, 'deposit'), eq(payment.state, 'paid')))
    .limit(1);
  const [latest] = await db
    .select()
    .from(payment)
    .where(and(eq(payment.quoteId, quoteId), eq(payment.kind, 'deposit')))
    .orderBy(desc(payment.createdAt))
    .limit(1);
  return { paid: paid ?? null, latest: latest ?? null, refunds: await refundsOf(quoteId, 'deposit') };
}

/** Money given back on the quote's payments of one kind: a refund carries the payment intent of the payment it returned. */
export async function refundsOf(quoteId: string, kind: 'deposit' | 'balance'): Promise<PaymentRow[]> {
  const rows = await db.select().from(payment).where(eq(payment.quoteId, quoteId)).orderBy(payment.createdAt);
  const intents = new Set(rows.filter((r) => r.kind === kind && r.paymentIntentId).map((r) => r.paymentIntentId));
  return rows.filter((r) => r.kind === 'refund' && intents.has(r.paymentIntentId));
}

/** Paid deposits of several quotes at once, by quote id (for lists). */
export async function paidDeposits(quoteIds: readonly string[]): Promise<Map<string, PaymentRow>> {
  if (quoteIds.length === 0) return new Map();
  const rows = await db
    .select()
    .from(payment)
    .where(and(inArray(payment.quoteId, [...quoteIds]), eq(payment.kind, 'deposit'), eq(payment.state, 'paid')));
  return new Map(rows.map((row) => [row.quoteId, row]));
}

/** What the quote page says while a payment the provider took is being confirmed, instead of offering to pay again. */
export const RECEIVED_TEXT = 'Payment received, being confirmed. This page refreshes by itself; there is nothing more to pay.';

/** What the client is told on coming back from the hosted checkout (the `payment` query value). */
export function returnMessage(
  value: string | null,
  paid: boolean,
): { tone: 'ok' | 'warn' | 'stop'; text: string; refresh: boolean } | null {
  switch (value) {
    case 'returned':
      return paid
        ? {
            tone: 'ok',
            text: 'Deposit received — thank you. A receipt is on its way by e-mail, and design work is being scheduled.',
            refresh: false,
          }
        : {
            tone: 'warn',
            text: 'We are confirming your payment with the payment provider. This page refreshes by itself in a few seconds.',
            refresh: true,
          };
    case 'received':
      return paid
        ? { tone: 'ok', text: 'Your deposit is paid; there is nothing more to pay on this quote.', refresh: false }
        : { tone: 'ok', text: RECEIVED_TEXT, refresh: true };
    case 'cancelled':
      return {
        tone: 'warn',
        text: 'You left the payment page before paying. Nothing was charged; pay the deposit whenever you are ready.',
        refresh: false,
      };
    case 'refused':
      return {
        tone: 'stop',
        text: 'The deposit cannot be paid on this quote right now: it may be paid already or no longer open. Reload the page to see its state.',
        refresh: false,
      };
    case 'unavailable':
      return {
        tone: 'stop',
        text: 'Online payment is not set up on this server. Reply to the quote e-mail and we will arrange the deposit another way.',
        refresh: false,
      };
    case 'provider-down':
      return { tone: 'stop', text: 'The payment service did not answer. Nothing was charged; try again in a minute.', refresh: false };
    default:
      return null;
  }
}
