/**
 * A deposit is taken once: a checkout paid while the webhook cannot reach the
 * app is applied when the client comes back (page or checkout), never replaced
 * by a second one; the database holds one paid deposit per quote; money taken
 * twice all the same goes back through the provider and is recorded.
 */
import { and, eq } from 'drizzle-orm';
import { describe, expect, inject, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { payment, webhookEvent } from '../../../src/lib/platform/db/schema';
import { SUCCESS_CARD } from '../../../stripe-fake/index';
import { execSql } from '../quotes/helpers';
import {
  acceptedQuote,
  completedEvent,
  holdCompletedWebhooks,
  mailSubjects,
  openCheckout,
  pay,
  quoteState,
  redeliver,
  stripe,
  until,
} from './helpers';

const databaseUrl = inject('databaseUrl');

async function paymentsOf(quoteId: string) {
  const { db, client } = connect(databaseUrl);
  try {
    return await db.select().from(payment).where(eq(payment.quoteId, quoteId)).orderBy(payment.createdAt);
  } finally {
    client.close();
  }
}

/** Pays the checkout while every completed-checkout delivery fails, and waits until the stand-in has tried. */
async function payWhileWebhookHeld(url: string, sessionId: string) {
  expect((await pay(url, SUCCESS_CARD)).status).toBe(303);
  return until(
    () => completedEvent(sessionId),
    (delivery) => (delivery?.attempts.length ?? 0) > 0,
    'the first failed delivery',
  );
}

describe('a deposit paid while the webhook is held', () => {
  test('opening checkout again applies the paid session instead of opening a second one; the late event records nothing twice', async () => {
    const rail = await acceptedQuote();
    const { url, sessionId } = await openCheckout(rail.client, rail.quote.id);
    const release = await holdCompletedWebhooks(databaseUrl);
    let eventId = '';
    try {
      eventId = (await payWhileWebhookHeld(url, sessionId))?.id ?? '';
      expect(await quoteState(rail.client, rail.quote.id)).toBe('accepted');

      const again = await rail.client.request(`/api/v1/quotes/${rail.quote.id}/checkout`, { method: 'POST' });
      expect(again.status).toBe(409);
      expect(await again.json()).toMatchObject({ error: 'deposit_received' });
      expect(await quoteState(rail.client, rail.quote.id)).toBe('deposit-paid');
    } finally {
      await release();
    }

    await redeliver(eventId);
    const { db, client } = connect(databaseUrl);
    try {
      const [recorded] = await until(
        () => db.select().from(webhookEvent).where(eq(webhookEvent.id, eventId)),
        (rows) => rows.length === 1,
        'the redelivered event',
      );
      expect(recorded?.outcome).toBe('already-paid');
    } finally {
      client.close();
    }
    const payments = await paymentsOf(rail.quote.id);
    expect(payments.map((p) => [p.checkoutSessionId, p.kind, p.state])).toEqual([[sessionId, 'deposit', 'paid']]);
    expect((await mailSubjects(rail.email)).filter((s) => s.startsWith('Receipt:'))).toHaveLength(1);
  });

  test('the quote page asks the provider and shows the deposit paid instead of offering to pay again', async () => {
    const rail = await acceptedQuote();
    const { url, sessionId } = await openCheckout(rail.client, rail.quote.id);
    const release = await holdCompletedWebhooks(databaseUrl);
    try {
      await payWhileWebhookHeld(url, sessionId);
      const page = await (await rail.client.request(`/quotes/${rail.quote.id}?payment=returned&session=${sessionId}`)).text();
      expect(page).not.toContain('Pay the deposit');
      expect(page).toContain('Paid on');
      expect(await quoteState(rail.client, rail.quote.id)).toBe('deposit-paid');
    } finally {
      await release();
    }
  });

  test('a completed payment that cannot be applied yet reads "payment received, being confirmed", with no second payment offered', async () => {
    const rail = await acceptedQuote();
    const { url, sessionId } = await openCheckout(rail.client, rail.quote.id);
    // The stored figure differs from what the provider took, so the payment is held for staff rather than applied.
    await execSql(databaseUrl, 'UPDATE payment SET amount_minor = amount_minor + 1 WHERE checkout_session_id = ?', [sessionId]);
    const release = await holdCompletedWebhooks(databaseUrl);
    try {
      await payWhileWebhookHeld(url, sessionId);
      const page = await (await rail.client.request(`/quotes/${rail.quote.id}`)).text();
      expect(page).toContain('Payment received, being confirmed');
      expect(page).not.toContain('Pay the deposit');
      const again = await rail.client.request(`/api/v1/quotes/${rail.quote.id}/checkout`, { method: 'POST' });
      expect(again.status).toBe(409);
      expect((await paymentsOf(rail.quote.id)).map((p) => p.state)).toEqual(['pending']);
      expect(await quoteState(rail.client, rail.quote.id)).toBe('accepted');
    } finally {
      await release();
    }
  });
});

describe('money taken twice', () => {
  test('a second paid checkout for a quote whose deposit is recorded is refunded through the provider and recorded as a refund', async () => {
    const rail = await acceptedQuote();
    const first = await openCheckout(rail.client, rail.quote.id);
    await pay(first.url, SUCCESS_CARD);
    await until(
      () => quoteState(rail.client, rail.quote.id),
      (s) => s === 'deposit-paid',
      'the first deposit',
    );

    // A second checkout for the same deposit that the client also paid (two tabs of an older page, a support mistake).
    const second = await stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: rail.quote.currency.toLowerCase(),
            unit_amount: rail.quote.depositMinor,
            product_data: { name: `Deposit for quote ${rail.quote.number}` },
          },
        },
      ],
      metadata: { quoteId: rail.quote.id },
      success_url: 'http://127.0.0.1/returned',
      cancel_url: 'http://127.0.0.1/cancelled',
    });
    await execSql(
      databaseUrl,
      `INSERT INTO payment (id, quote_id, kind, checkout_session_id, amount_minor, currency, state) VALUES (?, ?, 'deposit', ?, ?, ?, 'pending')`,
      [crypto.randomUUID(), rail.quote.id, second.id, rail.quote.depositMinor, rail.quote.currency],
    );
    expect((await pay(second.url ?? '', SUCCESS_CARD)).status).toBe(303);

    const settled = await until(
      () => paymentsOf(rail.quote.id),
      (rows) => rows.some((p) => p.kind === 'refund'),
      'the refund to be recorded',
    );
    const secondRow = settled.find((p) => p.checkoutSessionId === second.id);
    expect(secondRow?.state).toBe('refunded');
    const refunds = settled.filter((p) => p.kind === 'refund');
    expect(refunds).toHaveLength(1);
    expect(refunds[0]).toMatchObject({ amountMinor: rail.quote.depositMinor, paymentIntentId: secondRow?.paymentIntentId, state: 'paid' });
    const atProvider = await stripe.refunds.retrieve(refunds[0]?.checkoutSessionId ?? '');
    expect(atProvider).toMatchObject({ status: 'succeeded', amount: rail.quote.depositMinor, payment_intent: secondRow?.paymentIntentId });
    expect(settled.filter((p) => p.kind === 'deposit' && p.state === 'paid')).toHaveLength(1);
    expect(await quoteState(rail.client, rail.quote.id)).toBe('deposit-paid');
    const page = await (await rail.client.request(`/quotes/${rail.quote.id}`)).text();
    expect(page).toContain('could not count as the deposit was refunded in full');
    expect(page).toContain(refunds[0]?.checkoutSessionId);

    // The second checkout's event again: nothing is refunded or recorded twice.
    await redeliver((await completedEvent(second.id))?.id ?? '');
    await new Promise((r) => setTimeout(r, 500));
    expect((await paymentsOf(rail.quote.id)).filter((p) => p.kind === 'refund')).toHaveLength(1);
    expect((await mailSubjects(rail.email)).filter((s) => s.startsWith('Refund:'))).toHaveLength(1);
  });

  test('the database refuses a second paid deposit for one quote', async () => {
    const rail = await acceptedQuote();
    const { url } = await openCheckout(rail.client, rail.quote.id);
    await pay(url, SUCCESS_CARD);
    await until(
      () => quoteState(rail.client, rail.quote.id),
      (s) => s === 'deposit-paid',
      'the deposit',
    );
    await expect(
      execSql(
        databaseUrl,
        `INSERT INTO payment (id, quote_id, kind, checkout_session_id, amount_minor, currency, state) VALUES (?, ?, 'deposit', ?, 1, 'GBP', 'paid')`,
        [crypto.randomUUID(), rail.quote.id, `cs_test_second_${Date.now()}`],
      ),
    ).rejects.toThrow(/UNIQUE/);
    const { db, client } = connect(databaseUrl);
    try {
      const paid = await db
        .select()
        .from(payment)
        .where(and(eq(payment.quoteId, rail.quote.id), eq(payment.state, 'paid')));
      expect(paid).toHaveLength(1);
    } finally {
      client.close();
    }
  });
});
