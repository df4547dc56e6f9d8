import type { APIRoute } from 'astro';
import { guardApi } from '~/lib/platform/http/guard';
import { apiError, json } from '~/lib/platform/http/responses';
import { startDepositCheckout } from '~/lib/payments/checkout.server';
import { PaymentsNotConfigured } from '~/lib/payments/provider.server';

/** The owner client opens the hosted checkout for the accepted quote's deposit. */
export const POST: APIRoute = async (context) => {
  const gate = guardApi(context, ['client']);
  if (!gate.ok) return gate.response;
  try {
    const outcome = await startDepositCheckout(gate.user, context.params.id ?? '');
    if (outcome.ok) return json({ url: outcome.url });
    return apiError(outcome.status, outcome.status === 404 ? 'not_found' : 'wrong_state', { message: outcome.message });
  } catch (error) {
    if (error instanceof PaymentsNotConfigured) return apiError(503, 'payments_not_configured', { message: error.message });
    return apiError(502, 'payment_provider_unavailable', { message: 'The payment service did not answer; try again in a minute.' });
  }
};
