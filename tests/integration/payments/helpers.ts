/** The deposit path's steps, shared by the payment tests: an accepted quote, the hosted page, signed events, waiting. */
import Stripe from 'stripe';
import { expect, inject } from 'vitest';
import { Visitor } from '../../support/client';
import { TEST_STRIPE_KEY, TEST_WEBHOOK_SECRET } from '../../support/stack';
import { execSql, railUnderReview } from '../quotes/helpers';
import { SUCCESS_CARD } from '../../../stripe-fake/index';

const baseUrl = inject('baseUrl');
const stripeUrl = inject('stripeUrl');
const mailApiUrl = inject('mailApiUrl');
const stripeBase = new URL(stripeUrl);

export const stripe = new Stripe(TEST_STRIPE_KEY, { host: stripeBase.hostname, port: Number(stripeBase.port), protocol: 'http' });

export async function acceptedQuote() {
  const rail = await railUnderReview(baseUrl);
  const drafted = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } });
  expect(drafted.status).toBe(201);
  const quote = await drafted.json();
  expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
  expect((await rail.client.request(`/api/v1/quotes/${quote.id}/accept`, { method: 'POST' })).status).toBe(200);
  return { ...rail, quote: quote as { id: string; number: string; depositMinor: number; currency: string } };
}

/** An accepted quote whose deposit the client has paid with the test card, once the app has recorded it. */
export async function paidDepositQuote() {
  const rail = await acceptedQuote();
  const { url } = await openCheckout(rail.client, rail.quote.id);
  expect((await pay(url, SUCCESS_CARD)).status).toBe(303);
  await until(
    () => quoteState(rail.client, rail.quote.id),
    (s) => s === 'deposit-paid',
    'the deposit',
  );
  return rail;
}

/** Opens the deposit checkout as the client: the hosted page's address and its session id. */
export async function openCheckout(client: Visitor, quoteId: string): Promise<{ url: string; sessionId: string }> {
  const opened = await client.request(`/api/v1/quotes/${quoteId}/checkout`, { method: 'POST' });
  expect(opened.status).toBe(200);
  const { url } = (await opened.json()) as { url: string };
  return { url, sessionId: new URL(url).pathname.split('/').pop() ?? '' };
}

export async function pay(url: string, card: string) {
  const sessionPage = new URL(url);
  return fetch(`${sessionPage.origin}${sessionPage.pathname}/pay`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card_number: card }).toString(),
    redirect: 'manual',
  });
}

export async function until<T>(read: () => Promise<T>, ok: (value: T) => boolean, what: string, tries = 80): Promise<T> {
  for (let i = 0; i < tries; i++) {
    const value = await read();
    if (ok(value)) return value;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`Timed out waiting for ${what}`);
}

export const quoteState = async (visitor: Visitor, id: string) =>
  (await (await visitor.request(`/api/v1/quotes/${id}`)).json()).state as string;

export function signed(event: object, timestamp?: number) {
  const payload = JSON.stringify(event);
  const header = stripe.webhooks.generateTestHeaderString({ payload, secret: TEST_WEBHOOK_SECRET, ...(timestamp ? { timestamp } : {}) });
  return fetch(`${baseUrl}/api/v1/payments/webhook`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'stripe-signature': header },
    body: payload,
  });
}

export interface Delivery {
  id: string;
  delivered: boolean;
  attempts: { status?: number }[];
  event: { data: { object: { id: string } } };
}

/** The stand-in's `checkout.session.completed` event for one session, once raised. */
export async function completedEvent(sessionId: string): Promise<Delivery | undefined> {
  const { data } = (await (await fetch(`${stripeUrl}/__fake/events?type=checkout.session.completed`)).json()) as { data: Delivery[] };
  return data.find((d) => d.event.data.object.id === sessionId);
}

export async function redeliver(eventId: string) {
  const redelivered = await fetch(`${stripeUrl}/__fake/events/${eventId}/redeliver`, { method: 'POST' });
  expect(redelivered.ok).toBe(true);
}

export async function mailSubjects(to: string): Promise<string[]> {
  const list = (await (await fetch(`${mailApiUrl}/messages?to=${encodeURIComponent(to)}`)).json()) as
    { subject: string }[] | { messages: { subject: string }[] };
  return (Array.isArray(list) ? list : list.messages).map((m) => m.subject);
}

/**
 * Makes the app fail every delivery of a completed checkout, as when it is down
 * or the webhook is delayed past the provider's retries: a trigger refuses the
 * event's row. The page's and checkout's own check with the provider do not
 * record events, so they still work. Returns the release.
 */
export async function holdCompletedWebhooks(databaseUrl: string): Promise<() => Promise<void>> {
  await execSql(
    databaseUrl,
    `CREATE TRIGGER hold_completed_webhooks BEFORE INSERT ON webhook_event WHEN NEW.type = 'checkout.session.completed'
     BEGIN SELECT RAISE(ABORT, 'webhook held for the test'); END`,
    [],
  );
  return async () => {
    await execSql(databaseUrl, 'DROP TRIGGER IF EXISTS hold_completed_webhooks', []);
  };
}
