import { ApiError, invalidParam, missingParam, noSuchObject } from '../api/api-error.ts';
import { type ParamHash, optionalInteger, optionalMetadata, optionalString, rejectUnknown, requiredString } from '../api/form-params.ts';
import { newId, unixNow } from '../ids.ts';
import type { Refund } from '../objects.ts';
import type { FakeState } from '../state.ts';

const REASONS = ['duplicate', 'fraudulent', 'requested_by_customer'];

/** Refunds all or part of what a succeeded payment intent took, never more than is left. */
export function createRefund(state: FakeState, params: ParamHash): Refund {
  if (params['charge'] !== undefined) {
    throw invalidParam('charge', 'The local payment stand-in refunds by payment_intent only; pass payment_intent instead of charge.');
  }
  rejectUnknown(params, ['payment_intent', 'amount', 'reason', 'metadata']);
  const intentId = optionalString(params['payment_intent'], 'payment_intent');
  if (!intentId) throw missingParam('payment_intent');
  const intent = state.paymentIntents.get(intentId);
  if (!intent) throw noSuchObject('payment_intent', intentId, 'payment_intent', 400);
  if (intent.status !== 'succeeded') {
    throw new ApiError(
      400,
      `This PaymentIntent (${intent.id}) does not have a successful charge to refund; its status is ${intent.status}.`,
      {
        param: 'payment_intent',
        code: 'payment_intent_unexpected_state',
      },
    );
  }
  const remaining = intent.amount_received - state.refundedAmount(intent.id);
  if (remaining === 0) {
    throw new ApiError(400, `Charge ${intent.latest_charge} has already been refunded.`, { code: 'charge_already_refunded' });
  }
  const amount = optionalInteger(params['amount'], 'amount', { min: 1, max: Number.MAX_SAFE_INTEGER }) ?? remaining;
  if (amount > remaining) {
    throw new ApiError(400, `Refund amount (${amount}) is greater than the amount not yet refunded (${remaining}).`, {
      param: 'amount',
      code: 'amount_too_large',
    });
  }
  const reason = params['reason'] === undefined ? null : requiredString(params['reason'], 'reason');
  if (reason !== null && !REASONS.includes(reason)) {
    throw invalidParam('reason', `Invalid reason: must be one of ${REASONS.join(', ')}.`);
  }
  const refund: Refund = {
    id: newId('re_'),
    object: 'refund',
    amount,
    charge: intent.latest_charge,
    created: unixNow(),
    currency: intent.currency,
    metadata: optionalMetadata(params['metadata'], 'metadata') ?? {},
    payment_intent: intent.id,
    reason,
    status: 'succeeded',
  };
  state.refunds.set(refund.id, refund);
  return refund;
}
