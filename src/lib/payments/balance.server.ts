/** The client pays the balance invoiced on delivery, through the same hosted checkout as the deposit. */
import { and, eq } from 'drizzle-orm';
import { findInvoiceFor, invoiceOfQuote, type InvoiceView } from '~/lib/invoices/index.server';
import { db } from '../platform/db';
import { isStaff, type SignedInUser } from '../platform/http/guard';
import { refuse, succeed, type Outcome } from '../platform/outcome';
import { openOrReuseCheckout, type CheckoutOutcome } from './checkout.server';
import { payment, type PaymentRow } from '../platform/db/schema';

/** The invoice the client may pay (their own), else a not-found refusal: staff never pay. */
async function payableInvoice(viewer: SignedInUser, invoiceId: string): Promise<Outcome<InvoiceView>> {
  const view = isStaff(viewer) ? null : await findInvoiceFor(viewer, invoiceId);
  return view ? succeed(view) : refuse('not-found', 'No such invoice.');
}

/** Opens a hosted checkout for an invoice's balance; the amount is the one the invoice was issued with. */
export async function startBalanceCheckout(viewer: SignedInUser, invoiceId: string): Promise<CheckoutOutcome> {
  const found = await payableInvoice(viewer, invoiceId);
  if (!found.ok) return found;
  const { invoice, quote } = found.value;
  if (invoice.state === 'paid') return refuse('wrong-state', `Invoice ${invoice.number} is paid already; nothing more is due.`);
  if (invoice.balanceMinor <= 0) return refuse('wrong-state', `Invoice ${invoice.number} leaves no balance to pay.`);
  return openOrReuseCheckout(viewer, quote, {
    kind: 'balance',
    amountMinor: invoice.balanceMinor,
    name: `Balance of invoice ${invoice.number} (quote ${quote.number})`,
  });
}

/** The same, from the quote page: the quote's invoice, if it has one. */
export async function startBalanceCheckoutForQuote(viewer: SignedInUser, quoteId: string): Promise<CheckoutOutcome> {
  const view = await invoiceOfQuote(db, quoteId);
  return view ? startBalanceCheckout(viewer, view.invoice.id) : refuse('not-found', 'This quote has no invoice to pay.');
}

/** The paid balance of a quote, if any: its date and reference are shown beside the invoice. */
export async function paidBalance(quoteId: string): Promise<PaymentRow | null> {
  const [row] = await db
    .select()
    .from(payment)
    .where(and(eq(payment.quoteId, quoteId), eq(payment.kind, 'balance'), eq(payment.state, 'paid')))
    .limit(1);
  return row ?? null;
}

/** What the quote page says on the client's return from paying the balance, or after a refused attempt (the `balance` query value). */
export function balanceReturnMessage(
  value: string | null,
  paid: boolean,
): { tone: 'ok' | 'warn' | 'stop'; text: string; refresh: boolean } | null {
  switch (value) {
    case 'returned':
    case 'received':
      return paid
        ? { tone: 'ok', text: 'Balance received — thank you. The work is paid in full; a receipt is on its way by e-mail.', refresh: false }
        : {
            tone: 'warn',
            text: 'We are confirming your payment with the payment provider. This page refreshes by itself in a few seconds.',
            refresh: true,
          };
    case 'cancelled':
      return {
        tone: 'warn',
        text: 'You left the payment page before paying. Nothing was charged; pay the balance whenever you are ready.',
        refresh: false,
      };
    case 'refused':
      return {
        tone: 'stop',
        text: 'The balance cannot be paid right now: the invoice may be paid already. Reload the page to see its state.',
        refresh: false,
      };
    case 'provider-down':
      return {
        tone: 'stop',
        text: 'The payment service did not answer or is not set up. Nothing was charged; try again in a minute.',
        refresh: false,
      };
    default:
      return null;
  }
}
