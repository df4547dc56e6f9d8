import { apiMutation } from '~/lib/platform/http/mutation';
import { json } from '~/lib/platform/http/responses';
import { startDepositCheckout } from '~/lib/payments/checkout.server';

/** The owner client opens the hosted checkout for the accepted quote's deposit. */
export const POST = apiMutation({
  access: ['client'],
  run: ({ user, context }) => startDepositCheckout(user, context.params.id ?? ''),
  answer: (checkout) => json(checkout),
});
