/**
 * What the product checks in what the payment provider tells it, before
 * anything is recorded: the event's shape and signature time, and a paid
 * session's figures against the stored payment. Pure: no database, no network.
 */
import type Stripe from 'stripe';
import { z } from 'zod';
import type { PaymentRow } from '../platform/db/schema';
import { refuse, succeed, type Outcome } from '../platform/outcome';

/** How far a signature's timestamp may run ahead of our clock (seconds): the same window the SDK allows behind it. */
export const SIGNATURE_TOLERANCE_S = 300;

/**
 * The signature header's timestamp must not lie in the future beyond the
 * tolerance: the SDK only refuses old ones, and a far-future stamp would keep a
 * captured event replayable for as long as it is ahead.
 */
export function signedInFuture(signatureHeader: string, nowMs = Date.now()): boolean {
  const stamp = /(?:^|,)\s*t=(\d+)/.exec(signatureHeader)?.[1];
  return stamp !== undefined && Number(stamp) - Math.floor(nowMs / 1000) > SIGNATURE_TOLERANCE_S;
}

/** The fields every event is read by; a signed event without them is refused before anything is recorded. */
const eventShape = z.object({
  id: z.string().min(1),
  type: z.string().min(1),
  data: z.object({ object: z.object({ id: z.string().min(1) }) }),
});

/** The verified event if it has the shape we read, else an invalid-input refusal. */
export function readableEvent(event: Stripe.Event): Outcome<Stripe.Event> {
  const checked = eventShape.safeParse(event);
  if (checked.success) return succeed(event);
  return refuse('invalid', 'The event lacks its id, type or data object.', { code: 'malformed_event' });
}

/** What the provider says about one checkout session, in the figures we compare. */
export interface SessionReport {
  id: string;
  paid: boolean;
  amountMinor: number | null;
  currency: string | null;
  paymentIntentId: string | null;
}

/** A session object as the provider sends it (webhook) or answers it (retrieve, payment intent expanded). */
export function sessionReport(session: Stripe.Checkout.Session): SessionReport {
  const intent = session.payment_intent;
  const intentSucceeded = typeof intent === 'object' && intent?.status === 'succeeded';
  return {
    id: session.id,
    paid: session.payment_status === 'paid' || intentSucceeded,
    amountMinor: typeof session.amount_total === 'number' ? session.amount_total : null,
    currency: typeof session.currency === 'string' ? session.currency : null,
    paymentIntentId: typeof intent === 'string' ? intent : (intent?.id ?? null),
  };
}

/** Whether the provider took the amount and currency we asked for on this payment. */
export function matchesPayment(report: SessionReport, row: Pick<PaymentRow, 'amountMinor' | 'currency'>): boolean {
  return report.amountMinor === row.amountMinor && report.currency?.toLowerCase() === row.currency.toLowerCase();
}
