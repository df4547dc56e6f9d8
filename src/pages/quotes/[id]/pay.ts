import type { APIRoute } from 'astro';
import { startDepositCheckout } from '~/lib/payments/checkout.server';
import { PaymentsNotConfigured } from '~/lib/payments/provider.server';

/**
 * The quote page's "pay deposit" form: opens the hosted checkout and sends the
 * browser there (no JavaScript needed). Problems come back to the quote page in words.
 */
export const POST: APIRoute = async (context) => {
  const id = context.params.id ?? '';
  const back = (problem: string) => context.redirect(`/quotes/${id}?payment=${problem}`, 303);
  const user = context.locals.user;
  if (!user) return context.redirect(`/sign-in?next=${encodeURIComponent(`/quotes/${id}`)}`, 303);
  try {
    const outcome = await startDepositCheckout(user, id);
    if (outcome.ok) return context.redirect(outcome.url, 303);
    if (outcome.status === 404) return context.rewrite('/404');
    return back('refused');
  } catch (error) {
    return back(error instanceof PaymentsNotConfigured ? 'unavailable' : 'provider-down');
  }
};
