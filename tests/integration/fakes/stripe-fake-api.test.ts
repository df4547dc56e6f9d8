import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startStripeFake, type StripeFake } from '../../../stripe-fake/index.ts';

let fake: StripeFake;
let stripe: Stripe;

function client(key: string): Stripe {
  return new Stripe(key, { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
}

const depositParams = (quoteId: string): Stripe.Checkout.SessionCreateParams => ({
  mode: 'payment',
  line_items: [
    { quantity: 2, price_data: { currency: 'gbp', unit_amount: 12_500, product_data: { name: 'Design review' } } },
    { quantity: 1, price_data: { currency: 'gbp', unit_amount: 5_000, product_data: { name: 'Deposit handling' } } },
  ],
  metadata: { quoteId, kind: 'deposit' },
  client_reference_id: quoteId,
  customer_email: 'client@demo.railwright.test',
  success_url: 'http://127.0.0.1:4321/quotes/q1?checkout={CHECKOUT_SESSION_ID}',
  cancel_url: 'http://127.0.0.1:4321/quotes/q1?checkout=cancelled',
});

async function rejection(promise: Promise<unknown>): Promise<Stripe.errors.StripeError> {
  const error = await promise.then(
    () => {
      throw new Error('expected the call to fail');
    },
    (reason: unknown) => reason,
  );
  expect(error).toBeInstanceOf(Stripe.errors.StripeError);
  return error as Stripe.errors.StripeError;
}

beforeAll(async () => {
  fake = await startStripeFake({ port: 0 });
  stripe = client('sk_test_railwright');
});

afterAll(async () => {
  await fake.close();
});

describe('checkout sessions through the real SDK', () => {
  it('creates an open session with the totals, metadata and a hosted page URL', async () => {
    const before = Math.floor(Date.now() / 1000);
    const session = await stripe.checkout.sessions.create(depositParams('q1'));
    expect(session.id).toMatch(/^cs_test_\w+$/);
    expect(session).toMatchObject({
      object: 'checkout.session',
      mode: 'payment',
      amount_total: 30_000,
      amount_subtotal: 30_000,
      currency: 'gbp',
      status: 'open',
      payment_status: 'unpaid',
      payment_intent: null,
      livemode: false,
      metadata: { quoteId: 'q1', kind: 'deposit' },
      client_reference_id: 'q1',
      customer_email: 'client@demo.railwright.test',
      success_url: 'http://127.0.0.1:4321/quotes/q1?checkout={CHECKOUT_SESSION_ID}',
      cancel_url: 'http://127.0.0.1:4321/quotes/q1?checkout=cancelled',
      url: `${fake.url}/checkout/${session.id}`,
    });
    expect(session.created).toBeGreaterThanOrEqual(before);
    expect(session.expires_at).toBe(session.created + 24 * 60 * 60);
  });

  it('answers a repeated idempotency key with the first result, and refuses it with other parameters', async () => {
    const first = await stripe.checkout.sessions.create(depositParams('q2'), { idempotencyKey: 'checkout-q2' });
    const again = await stripe.checkout.sessions.create(depositParams('q2'), { idempotencyKey: 'checkout-q2' });
    expect(again.id).toBe(first.id);
    const other = await stripe.checkout.sessions.create(depositParams('q2'), { idempotencyKey: 'checkout-q2-other' });
    expect(other.id).not.toBe(first.id);

    const error = await rejection(stripe.checkout.sessions.create(depositParams('q3'), { idempotencyKey: 'checkout-q2' }));
    expect(error).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect(error.statusCode).toBe(400);
    expect(error.message).toContain("'checkout-q2'");
  });

  it('does not keep a key whose request failed validation, so the corrected request goes through', async () => {
    const broken = { ...depositParams('q4'), mode: 'subscription' as const };
    await rejection(stripe.checkout.sessions.create(broken, { idempotencyKey: 'checkout-q4' }));
    const session = await stripe.checkout.sessions.create(depositParams('q4'), { idempotencyKey: 'checkout-q4' });
    expect(session.metadata).toEqual({ quoteId: 'q4', kind: 'deposit' });
  });

  it('retrieves a session, expanding its line items', async () => {
    const created = await stripe.checkout.sessions.create(depositParams('q5'));
    const session = await stripe.checkout.sessions.retrieve(created.id, { expand: ['line_items', 'payment_intent'] });
    expect(session.id).toBe(created.id);
    expect(session.payment_intent).toBeNull();
    expect(session.line_items?.data.map((item) => [item.description, item.quantity, item.amount_total])).toEqual([
      ['Design review', 2, 25_000],
      ['Deposit handling', 1, 5_000],
    ]);
    expect(session.line_items?.data[0]?.price?.unit_amount).toBe(12_500);
  });

  it('lists line items page by page', async () => {
    const created = await stripe.checkout.sessions.create(depositParams('q6'));
    const firstPage = await stripe.checkout.sessions.listLineItems(created.id, { limit: 1 });
    expect(firstPage.data.map((item) => item.description)).toEqual(['Design review']);
    expect(firstPage.has_more).toBe(true);
    const all = await stripe.checkout.sessions.listLineItems(created.id, { limit: 1 }).autoPagingToArray({ limit: 10 });
    expect(all.map((item) => item.description)).toEqual(['Design review', 'Deposit handling']);
  });

  it('reports a missing nested parameter with its full name', async () => {
    const params = depositParams('q7');
    const error = await rejection(
      stripe.checkout.sessions.create({
        ...params,
        line_items: [{ quantity: 1, price_data: { currency: 'gbp', product_data: { name: 'No price' } } }],
      }),
    );
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(error.statusCode).toBe(400);
    expect(error.param).toBe('line_items[0][price_data][unit_amount]');
    expect(error.code).toBe('parameter_missing');
  });

  it('rejects an unknown currency, an unsupported mode and parameters it does not know', async () => {
    const params = depositParams('q8');
    const currency = await rejection(
      stripe.checkout.sessions.create({
        ...params,
        line_items: [{ quantity: 1, price_data: { currency: 'xyz', unit_amount: 100, product_data: { name: 'x' } } }],
      }),
    );
    expect(currency.param).toBe('line_items[0][price_data][currency]');

    const mode = await rejection(stripe.checkout.sessions.create({ ...params, mode: 'setup' }));
    expect(mode.param).toBe('mode');

    const unknown = await rejection(stripe.rawRequest('POST', '/v1/checkout/sessions', { ...params, amount: 3000 }));
    expect(unknown).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(unknown.param).toBe('amount');
    expect(unknown.code).toBe('parameter_unknown');

    const badUrl = await rejection(stripe.checkout.sessions.create({ ...params, success_url: 'not a url' }));
    expect(badUrl.param).toBe('success_url');

    const badQuantity = await rejection(
      stripe.rawRequest('POST', '/v1/checkout/sessions', {
        ...params,
        line_items: [{ quantity: 'two', price_data: { currency: 'gbp', unit_amount: 100, product_data: { name: 'x' } } }],
      }),
    );
    expect(badQuantity.param).toBe('line_items[0][quantity]');
    expect(badQuantity.code).toBe('parameter_invalid_integer');
  });

  it('answers 404 in the error shape for a session it does not have', async () => {
    const error = await rejection(stripe.checkout.sessions.retrieve('cs_test_missing'));
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(error.statusCode).toBe(404);
    expect(error.code).toBe('resource_missing');
    expect(error.message).toBe("No such checkout.session: 'cs_test_missing'");
  });

  it('refuses a wrong key with an authentication error', async () => {
    const error = await rejection(client('sk_live_not_for_tests').checkout.sessions.create(depositParams('q9')));
    expect(error).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect(error.statusCode).toBe(401);
    expect(error.message).toContain('sk_test_');
  });

  it('refuses a request without a key, in the error shape', async () => {
    const response = await fetch(`${fake.url}/v1/checkout/sessions/cs_test_x`);
    expect(response.status).toBe(401);
    const body = (await response.json()) as { error: { type: string; message: string } };
    expect(body.error.type).toBe('invalid_request_error');
    expect(body.error.message).toContain('Authorization');
  });

  it('expires an open session once', async () => {
    const created = await stripe.checkout.sessions.create(depositParams('q10'));
    const expired = await stripe.checkout.sessions.expire(created.id);
    expect(expired).toMatchObject({ id: created.id, status: 'expired', url: null, payment_status: 'unpaid' });
    const again = await rejection(stripe.checkout.sessions.expire(created.id));
    expect(again.statusCode).toBe(400);
    expect(again.message).toContain('"expired"');
  });

  it('names the calls it implements when asked for one it does not', async () => {
    const error = await rejection(stripe.customers.create({ email: 'x@example.test' }));
    expect(error.statusCode).toBe(404);
    expect(error.message).toContain('POST /v1/checkout/sessions');
  });
});
