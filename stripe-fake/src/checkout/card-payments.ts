import { newId, unixNow } from '../ids.ts';
import type { PaymentIntent, SessionRecord } from '../objects.ts';
import type { FakeState } from '../state.ts';

/** The test card numbers the hosted page knows. */
export const SUCCESS_CARD = '4242424242424242';
export const DECLINE_CARD = '4000000000000002';
export const DECLINE_MESSAGE = 'Your card was declined.';

type PaymentOutcome =
  | { kind: 'paid'; paymentIntent: PaymentIntent }
  | { kind: 'declined'; paymentIntent: PaymentIntent }
  | { kind: 'refused'; message: string };

/** Card numbers may be typed in groups of four; only spaces are tolerated. */
function normaliseCardNumber(input: string): string {
  return input.replace(/\s+/g, '');
}

function paymentIntentFor(state: FakeState, record: SessionRecord): PaymentIntent {
  const existing = record.session.payment_intent;
  if (existing) {
    const intent = state.paymentIntents.get(existing);
    if (intent) return intent;
  }
  // As in the API, the payment intent comes into being with the first attempt to pay.
  const intent: PaymentIntent = {
    id: newId('pi_'),
    object: 'payment_intent',
    amount: record.session.amount_total,
    amount_received: 0,
    canceled_at: null,
    created: unixNow(),
    currency: record.session.currency,
    description: record.paymentIntentData.description,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    metadata: record.paymentIntentData.metadata,
    payment_method_types: ['card'],
    status: 'requires_payment_method',
  };
  state.paymentIntents.set(intent.id, intent);
  record.session.payment_intent = intent.id;
  return intent;
}

/** Charges an open session with a test card number and moves the session and its intent on. */
export function payWithCard(state: FakeState, record: SessionRecord, cardInput: string): PaymentOutcome {
  const card = normaliseCardNumber(cardInput);
  if (card === '') return { kind: 'refused', message: 'Enter a card number.' };
  if (card !== SUCCESS_CARD && card !== DECLINE_CARD) {
    return {
      kind: 'refused',
      message: 'This test page accepts only its test cards: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined.',
    };
  }
  const intent = paymentIntentFor(state, record);
  if (card === DECLINE_CARD) {
    intent.last_payment_error = {
      type: 'card_error',
      code: 'card_declined',
      decline_code: 'generic_decline',
      message: DECLINE_MESSAGE,
    };
    return { kind: 'declined', paymentIntent: intent };
  }
  intent.status = 'succeeded';
  intent.amount_received = intent.amount;
  intent.last_payment_error = null;
  intent.latest_charge = newId('ch_');
  const session = record.session;
  session.status = 'complete';
  session.payment_status = 'paid';
  session.url = null;
  session.customer_details = { email: session.customer_email, name: null };
  return { kind: 'paid', paymentIntent: intent };
}

/** Expiring a session cancels the intent a failed attempt may have left behind. */
export function expireSession(state: FakeState, record: SessionRecord): void {
  const session = record.session;
  session.status = 'expired';
  session.url = null;
  const intent = session.payment_intent ? state.paymentIntents.get(session.payment_intent) : undefined;
  if (intent && intent.status !== 'succeeded') {
    intent.status = 'canceled';
    intent.canceled_at = unixNow();
  }
}
