import type { APIRoute } from 'astro';
import { startBalanceCheckoutForQuote } from '~/lib/payments/balance.server';

/**
 * The quote page's "pay the balance" form: opens the hosted checkout and sends
 * the browser there. Problems come back to the quote page in words.
 */
export const POST: APIRoute = async (context) => {
  const id = context.params.id ?? '';
  const user = context.locals.user;
  if (!user) return context.redirect(`/sign-in?next=${encodeURIComponent(`/quotes/${id}`)}`, 303);
  const outcome = await startBalanceCheckoutForQuote(user, id);
  if (outcome.ok) return context.redirect(outcome.value.url, 303);
  if (outcome.kind === 'not-found') return context.rewrite('/404');
  const problem = outcome.code === 'balance_received' ? 'received' : outcome.kind === 'wrong-state' ? 'refused' : 'provider-down';
  return context.redirect(`/quotes/${id}?balance=${problem}`, 303);
};
