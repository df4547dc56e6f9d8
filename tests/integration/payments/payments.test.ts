/**
 * The deposit path with the real stripe SDK against the real stand-in: checkout
 * session, hosted page, signed webhook, receipt — and the ways it must not go wrong.
 */
import { count, eq } from 'drizzle-orm';
import { describe, expect, inject, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { payment, webhookEvent } from '../../../src/lib/platform/db/schema';
import { DECLINE_CARD, SUCCESS_CARD } from '../../../stripe-fake/index';
import { DEMO, Visitor } from '../../support/client';
import { railUnderReview } from '../quotes/helpers';
import { acceptedQuote, pay, quoteState, signed, stripe, until } from './helpers';

const baseUrl = inject('baseUrl');
const stripeUrl = inject('stripeUrl');
const mailApiUrl = inject('mailApiUrl');
const databaseUrl = inject('databaseUrl');

describe('deposit checkout', () => {
  test('only the owner of an accepted quote opens a checkout, for the stored deposit', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
    expect((await rail.client.request(`/api/v1/quotes/${quote.id}/checkout`, { method: 'POST' })).status).toBe(404); // a draft is not shown to the client
    await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' });
    const early = await rail.client.request(`/api/v1/quotes/${quote.id}/checkout`, { method: 'POST' });
    expect(early.status).toBe(409);
    expect((await early.json()).message).toContain('Accept the quote first');
    await rail.client.request(`/api/v1/quotes/${quote.id}/accept`, { method: 'POST' });

    expect((await new Visitor(baseUrl).request(`/api/v1/quotes/${quote.id}/checkout`, { method: 'POST' })).status).toBe(401);
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/checkout`, { method: 'POST' })).status).toBe(403);
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    expect((await other.request(`/api/v1/quotes/${quote.id}/checkout`, { method: 'POST' })).status).toBe(404);

    const opened = await rail.client.request(`/api/v1/quotes/${quote.id}/checkout`, { method: 'POST' });
    expect(opened.status).toBe(200);
    const { url } = await opened.json();
    const sessionId = new URL(url).pathname.split('/').pop() ?? '';
    const session = await stripe.checkout.sessions.retrieve(sessionId);
    expect(session.amount_total).toBe(quote.depositMinor);
    expect(session.currency).toBe(quote.currency.toLowerCase());
    expect(session.metadata).toMatchObject({ quoteId: quote.id, quoteNumber: quote.number });
    expect(session.success_url).toContain(`/quotes/${quote.id}?payment=returned`);
    // A second click reuses the open session instead of starting another payment.
    const again = await (await rail.client.request(`/api/v1/quotes/${quote.id}/checkout`, { method: 'POST' })).json();
    expect(again.url).toBe(url);
  });

  test('the success card leads to "deposit paid" through the signed webhook, and a receipt', async () => {
    const rail = await acceptedQuote();
    const { url } = await (await rail.client.request(`/api/v1/quotes/${rail.quote.id}/checkout`, { method: 'POST' })).json();
    const declined = await pay(url, DECLINE_CARD);
    expect(declined.status).toBe(402);
    expect(await quoteState(rail.client, rail.quote.id)).toBe('accepted');

    const paid = await pay(url, SUCCESS_CARD);
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toContain(`/quotes/${rail.quote.id}?payment=returned`);
    await until(
      () => quoteState(rail.client, rail.quote.id),
      (s) => s === 'deposit-paid',
      'the quote to be paid',
    );
    const briefNow = await (await rail.client.request(`/api/v1/briefs/${rail.briefId}`)).json();
    expect(briefNow.state).toBe('deposit-paid');
    expect(briefNow.history.at(-1)).toMatchObject({ from: 'accepted', to: 'deposit-paid' });

    const mail = await until(
      async () =>
        (await (await fetch(`${mailApiUrl}/messages?to=${encodeURIComponent(rail.email)}`)).json()) as
          { subject: string }[] | { messages: { subject: string }[] },
      (list) => (Array.isArray(list) ? list : list.messages).some((m) => m.subject.startsWith('Receipt:')),
      'the receipt',
    );
    const receipt = (Array.isArray(mail) ? mail : mail.messages).find((m) => m.subject.startsWith('Receipt:'));
    expect(receipt?.subject).toContain(rail.quote.number);
    expect((await rail.client.request(`/api/v1/quotes/${rail.quote.id}/checkout`, { method: 'POST' })).status).toBe(409);
  });
});

describe('webhook', () => {
  test('a forged signature or a stale timestamp is refused and changes nothing', async () => {
    const forged = await fetch(`${baseUrl}/api/v1/payments/webhook`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'stripe-signature': 't=1,v1=deadbeef' },
      body: JSON.stringify({ id: 'evt_forged', type: 'checkout.session.completed', data: { object: {} } }),
    });
    expect(forged.status).toBe(400);
    const stale = await signed(
      {
        id: 'evt_stale',
        object: 'event',
        type: 'checkout.session.completed',
        data: { object: { id: 'cs_x', object: 'checkout.session' } },
      },
      Math.floor(Date.now() / 1000) - 3600,
    );
    expect(stale.status).toBe(400);
    expect((await fetch(`${baseUrl}/api/v1/payments/webhook`, { method: 'POST', body: '{}' })).status).toBe(400);
    const { db, client } = connect(databaseUrl);
    const rows = await db.select().from(webhookEvent).where(eq(webhookEvent.id, 'evt_forged'));
    client.close();
    expect(rows).toHaveLength(0);
  });

  test('the same event three times makes one payment; unknown sessions are recorded and ignored; a late "expired" does not undo a payment', async () => {
    const rail = await acceptedQuote();
    const { url } = await (await rail.client.request(`/api/v1/quotes/${rail.quote.id}/checkout`, { method: 'POST' })).json();
    const sessionId = new URL(url).pathname.split('/').pop() ?? '';
    await pay(url, SUCCESS_CARD);
    await until(
      () => quoteState(rail.client, rail.quote.id),
      (s) => s === 'deposit-paid',
      'the quote to be paid',
    );

    type Delivery = { id: string; event: { data: { object: { id: string } } } };
    const { data: deliveries } = (await (await fetch(`${stripeUrl}/__fake/events?type=checkout.session.completed`)).json()) as {
      data: Delivery[];
    };
    const completed = deliveries.find((d) => d.event.data.object.id === sessionId);
    expect(completed).toBeDefined();
    for (let i = 0; i < 2; i++) {
      const redelivered = await fetch(`${stripeUrl}/__fake/events/${completed?.id}/redeliver`, { method: 'POST' });
      expect(redelivered.ok).toBe(true);
    }
    await new Promise((r) => setTimeout(r, 500));

    const { db, client } = connect(databaseUrl);
    try {
      const payments = await db.select().from(payment).where(eq(payment.checkoutSessionId, sessionId));
      expect(payments).toHaveLength(1);
      expect(payments[0]?.state).toBe('paid');
      const [recorded] = await db
        .select({ n: count() })
        .from(webhookEvent)
        .where(eq(webhookEvent.id, completed?.id ?? ''));
      expect(recorded?.n).toBe(1);

      const late = await signed({
        id: `evt_late_${sessionId}`,
        object: 'event',
        type: 'checkout.session.expired',
        data: { object: { id: sessionId, object: 'checkout.session', payment_status: 'unpaid', status: 'expired' } },
      });
      expect(late.status).toBe(200);
      expect((await late.json()).outcome).toBe('ignored');
      expect(await quoteState(rail.client, rail.quote.id)).toBe('deposit-paid');

      const stranger = await signed({
        id: `evt_unknown_${Date.now()}`,
        object: 'event',
        type: 'checkout.session.completed',
        data: { object: { id: 'cs_test_nobody', object: 'checkout.session', payment_status: 'paid' } },
      });
      expect((await stranger.json()).outcome).toBe('unknown-session');
      const other = await signed({
        id: `evt_other_${Date.now()}`,
        object: 'event',
        type: 'customer.created',
        data: { object: { id: 'cus_1' } },
      });
      expect((await other.json()).outcome).toBe('ignored');
    } finally {
      client.close();
    }

    const receipts = (await (await fetch(`${mailApiUrl}/messages?to=${encodeURIComponent(rail.email)}`)).json()) as
      { subject: string }[] | { messages: { subject: string }[] };
    expect((Array.isArray(receipts) ? receipts : receipts.messages).filter((m) => m.subject.startsWith('Receipt:'))).toHaveLength(1);
  });
});
