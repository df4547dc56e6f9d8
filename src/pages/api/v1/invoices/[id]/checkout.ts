import { apiMutation } from '~/lib/platform/http/mutation';
import { json } from '~/lib/platform/http/responses';
import { startBalanceCheckout } from '~/lib/payments/balance.server';

/** The owner client opens the hosted checkout for the invoice's balance. */
export const POST = apiMutation({
  access: ['client'],
  run: ({ user, context }) => startBalanceCheckout(user, context.params.id ?? ''),
  answer: (checkout) => json(checkout),
});
