/**
 * The webhook believes nothing it did not ask for: a completed checkout whose
 * amount or currency differs from the stored payment is recorded and not
 * applied; a signature from the future and a signed event without its id or
 * data are refused as bad input.
 */
import { eq } from 'drizzle-orm';
import { describe, expect, inject, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { payment, webhookEvent } from '../../../src/lib/platform/db/schema';
import { acceptedQuote, openCheckout, quoteState, signed } from './helpers';

const databaseUrl = inject('databaseUrl');

const completed = (id: string, session: object) => ({
  id,
  object: 'event',
  type: 'checkout.session.completed',
  data: { object: { object: 'checkout.session', status: 'complete', payment_status: 'paid', ...session } },
});

describe('webhook figures', () => {
  test('an amount or currency other than the stored payment is recorded as a mismatch and not applied', async () => {
    const rail = await acceptedQuote();
    const { sessionId } = await openCheckout(rail.client, rail.quote.id);
    const currency = rail.quote.currency.toLowerCase();
    const tag = Date.now().toString(36);

    const cheaper = await signed(
      completed(`evt_amount_${tag}`, { id: sessionId, amount_total: 1, currency, payment_intent: `pi_amount_${tag}` }),
    );
    expect(cheaper.status).toBe(200);
    expect((await cheaper.json()).outcome).toBe('amount-mismatch');
    const otherCurrency = await signed(
      completed(`evt_currency_${tag}`, {
        id: sessionId,
        amount_total: rail.quote.depositMinor,
        currency: currency === 'usd' ? 'eur' : 'usd',
        payment_intent: `pi_currency_${tag}`,
      }),
    );
    expect((await otherCurrency.json()).outcome).toBe('amount-mismatch');

    expect(await quoteState(rail.client, rail.quote.id)).toBe('accepted');
    const { db, client } = connect(databaseUrl);
    try {
      const [stored] = await db.select().from(payment).where(eq(payment.checkoutSessionId, sessionId));
      expect(stored?.state).toBe('pending');
      const [recorded] = await db
        .select()
        .from(webhookEvent)
        .where(eq(webhookEvent.id, `evt_amount_${tag}`));
      expect(recorded?.outcome).toBe('amount-mismatch');
    } finally {
      client.close();
    }

    const right = await signed(
      completed(`evt_right_${tag}`, { id: sessionId, amount_total: rail.quote.depositMinor, currency, payment_intent: `pi_right_${tag}` }),
    );
    expect((await right.json()).outcome).toBe('deposit-paid');
    expect(await quoteState(rail.client, rail.quote.id)).toBe('deposit-paid');
  });
});

describe('webhook input', () => {
  test('a signature dated beyond the tolerance in the future is refused and changes nothing', async () => {
    const id = `evt_future_${Date.now()}`;
    const future = await signed(completed(id, { id: 'cs_test_future' }), Math.floor(Date.now() / 1000) + 3600);
    expect(future.status).toBe(400);
    const { db, client } = connect(databaseUrl);
    try {
      expect(await db.select().from(webhookEvent).where(eq(webhookEvent.id, id))).toHaveLength(0);
    } finally {
      client.close();
    }
  });

  test('a signed event without its id or its data is bad input (400), not a server fault', async () => {
    const noId = await signed({ object: 'event', type: 'checkout.session.completed', data: { object: { id: 'cs_test_x' } } });
    expect(noId.status).toBe(400);
    expect((await noId.json()).error).toBe('malformed_event');
    const noData = await signed({ id: `evt_nodata_${Date.now()}`, object: 'event', type: 'checkout.session.completed' });
    expect(noData.status).toBe(400);
    const noObject = await signed({ id: `evt_noobject_${Date.now()}`, object: 'event', type: 'checkout.session.expired', data: {} });
    expect(noObject.status).toBe(400);
  });
});
