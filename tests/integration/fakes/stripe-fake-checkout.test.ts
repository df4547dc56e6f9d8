import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DECLINE_CARD, SUCCESS_CARD, startStripeFake, type StripeFake } from '../../../stripe-fake/index.ts';
import { eventually, freePort, startWebhookReceiver, type WebhookReceiver } from './helpers.ts';

const SECRET = 'whsec_checkout_test_secret';

let receiver: WebhookReceiver;
let fake: StripeFake;
let stripe: Stripe;

interface FakeDelivery {
  id: string;
  type: string;
  delivered: boolean;
  attempts: { status: number | null; error: string | null }[];
  event: Stripe.Event;
}

async function deliveries(target: StripeFake = fake): Promise<FakeDelivery[]> {
  const response = await fetch(`${target.url}/__fake/events`);
  return ((await response.json()) as { data: FakeDelivery[] }).data;
}

async function deliveryOf(type: string, objectId: string, target: StripeFake = fake): Promise<FakeDelivery | undefined> {
  return (await deliveries(target)).find(
    (delivery) => delivery.type === type && (delivery.event.data.object as { id: string }).id === objectId,
  );
}

function received(type: string, objectId: string): { body: string; signature: string }[] {
  return receiver.received
    .filter((entry) => {
      const event = JSON.parse(entry.body) as Stripe.Event;
      return event.type === type && (event.data.object as { id: string }).id === objectId;
    })
    .map((entry) => ({ body: entry.body, signature: String(entry.headers['stripe-signature']) }));
}

async function newSession(quoteId: string, amount = 123_450): Promise<Stripe.Checkout.Session> {
  return stripe.checkout.sessions.create({
    mode: 'payment',
    line_items: [
      { quantity: 1, price_data: { currency: 'gbp', unit_amount: amount, product_data: { name: `Deposit for quote ${quoteId}` } } },
    ],
    metadata: { quoteId },
    payment_intent_data: { metadata: { quoteId } },
    customer_email: 'client@demo.railwright.test',
    success_url: `http://127.0.0.1:4321/quotes/${quoteId}?paid={CHECKOUT_SESSION_ID}`,
    cancel_url: `http://127.0.0.1:4321/quotes/${quoteId}?cancelled=1`,
  });
}

function pay(session: Stripe.Checkout.Session, cardNumber: string, target: StripeFake = fake): Promise<Response> {
  return fetch(`${target.url}/checkout/${session.id}/pay`, {
    method: 'POST',
    body: new URLSearchParams({ card_number: cardNumber }),
    redirect: 'manual',
  });
}

function spaced(card: string): string {
  return card.replace(/(\d{4})(?=\d)/g, '$1 ');
}

beforeAll(async () => {
  receiver = await startWebhookReceiver();
  fake = await startStripeFake({ port: 0, webhookUrl: receiver.url, webhookSecret: SECRET });
  stripe = new Stripe('sk_test_checkout', { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
});

afterAll(async () => {
  await fake.close();
  await receiver.close();
});

describe('the hosted checkout page', () => {
  it('shows the amount, the description, a labelled card field and the way back', async () => {
    const session = await newSession('page');
    const response = await fetch(session.url ?? '');
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toContain('text/html');
    const html = await response.text();
    expect(html).toContain('Local test payment page');
    expect(html).toContain('£1,234.50');
    expect(html).toContain('Deposit for quote page');
    expect(html).toMatch(/<label for="card_number">Card number<\/label>/);
    expect(html).toMatch(/<input id="card_number" name="card_number"/);
    expect(html).toContain(`action="/checkout/${session.id}/pay"`);
    expect(html).toContain('href="http://127.0.0.1:4321/quotes/page?cancelled=1"');
  });

  it('formats amounts in the currency of the session', async () => {
    const session = await stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [{ quantity: 3, price_data: { currency: 'jpy', unit_amount: 1500, product_data: { name: 'Parts' } } }],
    });
    const html = await (await fetch(session.url ?? '')).text();
    expect(html).toContain('JP¥4,500');
  });

  it('shows a decline on the page with 402 and leaves the session open', async () => {
    const session = await newSession('declined');
    const response = await pay(session, spaced(DECLINE_CARD));
    expect(response.status).toBe(402);
    expect(await response.text()).toContain('Your card was declined.');

    const after = await stripe.checkout.sessions.retrieve(session.id, { expand: ['payment_intent'] });
    expect(after.status).toBe('open');
    expect(after.payment_status).toBe('unpaid');
    const intent = after.payment_intent as Stripe.PaymentIntent;
    expect(intent.status).toBe('requires_payment_method');
    expect(intent.last_payment_error?.code).toBe('card_declined');
    expect(intent.metadata).toEqual({ quoteId: 'declined' });
    await eventually(
      'the payment_failed event to be delivered',
      async () => (await deliveryOf('payment_intent.payment_failed', intent.id))?.delivered || undefined,
    );
    expect(await deliveryOf('checkout.session.completed', session.id)).toBeUndefined();
  });

  it('refuses other card numbers with a message and creates nothing', async () => {
    const session = await newSession('refused');
    for (const card of ['4111111111111111', 'not a card', '']) {
      const response = await pay(session, card);
      expect(response.status).toBe(400);
      expect(await response.text()).toMatch(/accepts only its test cards|Enter a card number/);
    }
    const after = await stripe.checkout.sessions.retrieve(session.id);
    expect(after.status).toBe('open');
    expect(after.payment_intent).toBeNull();
  });

  it('answers 404 with an explanation for a session it does not know', async () => {
    const response = await fetch(`${fake.url}/checkout/cs_test_unknown`);
    expect(response.status).toBe(404);
    expect(await response.text()).toContain('start the payment again');
  });
});

describe('a successful payment', () => {
  let session: Stripe.Checkout.Session;
  let redirect: Response;

  beforeAll(async () => {
    session = await newSession('paid');
    redirect = await pay(session, spaced(SUCCESS_CARD));
  });

  it('redirects to the success URL with the session id in place of the template', () => {
    expect(redirect.status).toBe(303);
    expect(redirect.headers.get('location')).toBe(`http://127.0.0.1:4321/quotes/paid?paid=${session.id}`);
  });

  it('completes the session and its payment intent', async () => {
    const after = await stripe.checkout.sessions.retrieve(session.id);
    expect(after).toMatchObject({ status: 'complete', payment_status: 'paid', url: null });
    expect(after.payment_intent).toMatch(/^pi_\w+$/);
    const intent = await stripe.paymentIntents.retrieve(after.payment_intent as string);
    expect(intent).toMatchObject({
      object: 'payment_intent',
      status: 'succeeded',
      amount: 123_450,
      amount_received: 123_450,
      currency: 'gbp',
    });
  });

  it('posts a checkout.session.completed event that the SDK verifies with the secret', async () => {
    const [delivery] = await eventually('the completed event at the receiver', () => {
      const copies = received('checkout.session.completed', session.id);
      return copies.length > 0 ? copies : undefined;
    });
    expect(delivery?.signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    const event = stripe.webhooks.constructEvent(delivery?.body ?? '', delivery?.signature ?? '', SECRET);
    expect(event).toMatchObject({ object: 'event', type: 'checkout.session.completed', livemode: false, api_version: expect.any(String) });
    expect(event.id).toMatch(/^evt_\w+$/);
    const completed = event.data.object as Stripe.Checkout.Session;
    expect(completed).toMatchObject({
      id: session.id,
      status: 'complete',
      payment_status: 'paid',
      metadata: { quoteId: 'paid' },
      amount_total: 123_450,
    });
  });

  it('fails verification with another secret or an altered body', async () => {
    const [delivery] = received('checkout.session.completed', session.id);
    const body = delivery?.body ?? '';
    const signature = delivery?.signature ?? '';
    expect(() => stripe.webhooks.constructEvent(body, signature, 'whsec_someone_else')).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
    expect(() => stripe.webhooks.constructEvent(body.replace('"paid"', '"unpaid"'), signature, SECRET)).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
  });

  it('also posts payment_intent.succeeded', async () => {
    const after = await stripe.checkout.sessions.retrieve(session.id);
    const [delivery] = await eventually('the payment intent event', () => {
      const copies = received('payment_intent.succeeded', after.payment_intent as string);
      return copies.length > 0 ? copies : undefined;
    });
    const event = stripe.webhooks.constructEvent(delivery?.body ?? '', delivery?.signature ?? '', SECRET);
    expect((event.data.object as Stripe.PaymentIntent).status).toBe('succeeded');
  });

  it('cannot be paid twice', async () => {
    const response = await pay(session, SUCCESS_CARD);
    expect(response.status).toBe(409);
    expect(await response.text()).toContain('This payment is complete.');
  });

  it('charges once when the pay form is posted twice at the same time', async () => {
    const twice = await newSession('twice');
    const statuses = (await Promise.all([pay(twice, SUCCESS_CARD), pay(twice, SUCCESS_CARD)])).map((response) => response.status);
    expect(statuses.sort()).toEqual([303, 409]);
    const completed = (await deliveries()).filter(
      (delivery) => delivery.type === 'checkout.session.completed' && (delivery.event.data.object as { id: string }).id === twice.id,
    );
    expect(completed).toHaveLength(1);
  });

  it('redelivers an event unchanged on request', async () => {
    const delivery = await deliveryOf('checkout.session.completed', session.id);
    const response = await fetch(`${fake.url}/__fake/events/${delivery?.id}/redeliver`, { method: 'POST' });
    expect(response.status).toBe(202);
    const copies = await eventually('a second copy', () => {
      const all = received('checkout.session.completed', session.id);
      return all.length === 2 ? all : undefined;
    });
    const ids = copies.map((copy) => stripe.webhooks.constructEvent(copy.body, copy.signature, SECRET).id);
    expect(ids[1]).toBe(ids[0]);
  });
});

describe('webhook retries', () => {
  it('retries a delivery the receiver refused, after the redirect has been answered', async () => {
    receiver.answerWith((body, earlierCopies) => (body.includes('"retry-me"') && earlierCopies === 0 ? 500 : 200));
    try {
      const session = await newSession('retry-me');
      const response = await pay(session, SUCCESS_CARD);
      expect(response.status).toBe(303);
      expect((await deliveryOf('checkout.session.completed', session.id))?.delivered).toBe(false);

      const delivery = await eventually('the retried delivery', async () => {
        const found = await deliveryOf('checkout.session.completed', session.id);
        return found?.delivered ? found : undefined;
      });
      expect(delivery.attempts.map((attempt) => attempt.status)).toEqual([500, 200]);
      const copies = receiver.received.filter(
        (entry) => entry.body.includes(session.id) && entry.body.includes('checkout.session.completed'),
      );
      expect(copies).toHaveLength(2);
      const [first, second] = copies;
      expect((second?.receivedAt ?? 0) - (first?.receivedAt ?? 0)).toBeGreaterThanOrEqual(450);
      expect(stripe.webhooks.constructEvent(second?.body ?? '', String(second?.headers['stripe-signature']), SECRET).type).toBe(
        'checkout.session.completed',
      );
    } finally {
      receiver.answerWith(() => 200);
    }
  });

  it('gives up after the configured retries, recording each failure', async () => {
    const unreachable = `http://127.0.0.1:${await freePort()}/webhook`;
    const quick = await startStripeFake({ port: 0, webhookUrl: unreachable, webhookSecret: SECRET, webhookRetryDelaysMs: [10, 20] });
    try {
      const quickStripe = new Stripe('sk_test_quick', { host: '127.0.0.1', port: quick.port, protocol: 'http', maxNetworkRetries: 0 });
      const created = await quickStripe.checkout.sessions.create({
        mode: 'payment',
        line_items: [{ quantity: 1, price_data: { currency: 'eur', unit_amount: 1000, product_data: { name: 'x' } } }],
      });
      const expired = await quickStripe.checkout.sessions.expire(created.id);
      const delivery = await eventually('three failed attempts', async () => {
        const found = await deliveryOf('checkout.session.expired', expired.id, quick);
        return found && found.attempts.length === 3 ? found : undefined;
      });
      expect(delivery.delivered).toBe(false);
      expect(delivery.attempts.every((attempt) => attempt.status === null && attempt.error)).toBe(true);
    } finally {
      await quick.close();
    }
  });
});

describe('expiry', () => {
  it('sends a signed checkout.session.expired event', async () => {
    const session = await newSession('expire');
    await stripe.checkout.sessions.expire(session.id);
    const [copy] = await eventually('the expired event', () => {
      const copies = received('checkout.session.expired', session.id);
      return copies.length > 0 ? copies : undefined;
    });
    const event = stripe.webhooks.constructEvent(copy?.body ?? '', copy?.signature ?? '', SECRET);
    expect((event.data.object as Stripe.Checkout.Session).status).toBe('expired');
    expect(event.request?.id).toMatch(/^req_/);
    const page = await fetch(session.url ?? '');
    expect(page.status).toBe(410);
  });
});

describe('refunds', () => {
  let intentId: string;

  beforeAll(async () => {
    const session = await newSession('refund', 100_000);
    await pay(session, SUCCESS_CARD);
    intentId = (await stripe.checkout.sessions.retrieve(session.id)).payment_intent as string;
  });

  it('refunds part, then the rest, and never more than was paid', async () => {
    const part = await stripe.refunds.create({ payment_intent: intentId, amount: 40_000, reason: 'requested_by_customer' });
    expect(part).toMatchObject({ object: 'refund', amount: 40_000, currency: 'gbp', payment_intent: intentId, status: 'succeeded' });
    expect(part.id).toMatch(/^re_\w+$/);
    expect((await stripe.refunds.retrieve(part.id)).amount).toBe(40_000);

    const tooMuch = await stripe.refunds.create({ payment_intent: intentId, amount: 60_001 }).catch((error: unknown) => error);
    expect(tooMuch).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((tooMuch as Stripe.errors.StripeError).param).toBe('amount');

    const rest = await stripe.refunds.create({ payment_intent: intentId });
    expect(rest.amount).toBe(60_000);

    const none = await stripe.refunds.create({ payment_intent: intentId, amount: 1 }).catch((error: unknown) => error);
    expect((none as Stripe.errors.StripeError).code).toBe('charge_already_refunded');
  });

  it('refuses to refund an unpaid or unknown payment intent', async () => {
    const session = await newSession('refund-unpaid');
    await pay(session, DECLINE_CARD);
    const unpaid = (await stripe.checkout.sessions.retrieve(session.id)).payment_intent as string;
    const notPaid = await stripe.refunds.create({ payment_intent: unpaid }).catch((error: unknown) => error);
    expect((notPaid as Stripe.errors.StripeError).code).toBe('payment_intent_unexpected_state');

    const unknown = await stripe.refunds.create({ payment_intent: 'pi_unknown' }).catch((error: unknown) => error);
    expect(unknown).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((unknown as Stripe.errors.StripeError).code).toBe('resource_missing');

    const missingRefund = await stripe.refunds.retrieve('re_unknown').catch((error: unknown) => error);
    expect((missingRefund as Stripe.errors.StripeError).statusCode).toBe(404);
  });
});
