/**
 * While a checkout (deposit or balance) is pending, the provider knows more than we do: the
 * client may have paid while the webhook was delayed or the app was down. The
 * quote page and checkout ask the provider before offering to pay again.
 */
import { and, desc, eq } from 'drizzle-orm';
import { db } from '../platform/db';
import { payment, type PaymentRow } from '../platform/db/schema';
import { log } from '../platform/log';
import { paymentProvider } from './provider.server';
import { sessionReport } from './event-checks';
import { afterSettle, settlePaidSession } from './settle.server';

export type PendingPayment =
  | { kind: 'none' }
  /** The client can still pay on this hosted page. */
  | { kind: 'open'; url: string }
  /** The client paid: applied now, or still being confirmed (clearing, or held for staff when a figure does not match). */
  | { kind: 'received'; applied: boolean }
  /** The provider will not take money on it any more; a new checkout may replace it. */
  | { kind: 'stale'; payment: PaymentRow };

/** Asks the provider about the quote's pending checkout of this kind and applies it if paid (the webhook's own path). */
export async function checkPendingPayment(quoteId: string, kind: 'deposit' | 'balance'): Promise<PendingPayment> {
  const [pending] = await db
    .select()
    .from(payment)
    .where(and(eq(payment.quoteId, quoteId), eq(payment.kind, kind), eq(payment.state, 'pending')))
    .orderBy(desc(payment.createdAt))
    .limit(1);
  if (!pending) return { kind: 'none' };
  const session = await paymentProvider().checkout.sessions.retrieve(pending.checkoutSessionId, { expand: ['payment_intent'] });
  const report = sessionReport(session);
  if (report.paid) {
    const settled = await db.transaction((tx) => settlePaidSession(tx, report));
    await afterSettle(settled);
    const applied = settled.result === 'deposit-paid' || settled.result === 'balance-paid' || settled.result === 'already-paid';
    return { kind: 'received', applied };
  }
  if (session.status === 'expired') return { kind: 'stale', payment: pending };
  if (session.status === 'open' && session.url) return { kind: 'open', url: session.url };
  // Complete but not yet paid (a payment still clearing): never replaced, the provider's event settles it.
  return { kind: 'received', applied: false };
}

/** The same check for a page: a provider that does not answer leaves the page as it was. */
export async function checkPendingPaymentQuietly(quoteId: string, kind: 'deposit' | 'balance'): Promise<PendingPayment | null> {
  try {
    return await checkPendingPayment(quoteId, kind);
  } catch (error) {
    log.warn({ err: error, quoteId }, 'the payment provider did not answer the pending-payment check');
    return null;
  }
}
