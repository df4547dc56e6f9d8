import type { APIRoute } from 'astro';
import { readLimitedText } from '~/lib/platform/http/body';
import { apiError, json, refusalResponse } from '~/lib/platform/http/responses';
import { paymentProvider, PaymentsNotConfigured, webhookSecret } from '~/lib/payments/provider.server';
import { readableEvent, signedInFuture, SIGNATURE_TOLERANCE_S } from '~/lib/payments/event-checks';
import { applyPaymentEvent } from '~/lib/payments/webhook.server';

const MAX_EVENT_BYTES = 256 * 1024;

/** Signed events from the payment provider: verified with the SDK, applied once each. */
export const POST: APIRoute = async ({ request }) => {
  const signature = request.headers.get('stripe-signature');
  if (!signature) return apiError(400, 'missing_signature', { message: 'The Stripe-Signature header is missing.' });
  const read = await readLimitedText(request, MAX_EVENT_BYTES);
  if (!read.ok) return refusalResponse(read);
  const body = read.value;
  if (signedInFuture(signature)) {
    return apiError(400, 'bad_signature', { message: "The event is signed with a time in the future; check the sender's clock." });
  }
  let event;
  try {
    event = paymentProvider().webhooks.constructEvent(body, signature, webhookSecret(), SIGNATURE_TOLERANCE_S);
  } catch (error) {
    if (error instanceof PaymentsNotConfigured) return apiError(503, 'payments_not_configured', { message: error.message });
    // Bad signature or a timestamp outside the tolerance (replayed later).
    return apiError(400, 'bad_signature', { message: 'The event signature does not verify.' });
  }
  const readable = readableEvent(event);
  if (!readable.ok) return refusalResponse(readable);
  const outcome = await applyPaymentEvent(readable.value);
  return json({ received: true, outcome });
};
