import type { APIRoute } from 'astro';
import { startDepositCheckout } from '~/lib/payments/checkout.server';
import type { RefusalKind } from '~/lib/platform/outcome';

/**
 * The quote page's "pay deposit" form: opens the hosted checkout and sends the
 * browser there (no JavaScript needed). Problems come back to the quote page in words.
 */
export const POST: APIRoute = async (context) => {
  const id = context.params.id ?? '';
  const back = (problem: string) => context.redirect(`/quotes/${id}?payment=${problem}`, 303);
  const user = context.locals.user;
  if (!user) return context.redirect(`/sign-in?next=${encodeURIComponent(`/quotes/${id}`)}`, 303);
  const outcome = await startDepositCheckout(user, id);
  if (outcome.ok) return context.redirect(outcome.value.url, 303);
  if (outcome.kind === 'not-found') return context.rewrite('/404');
  if (outcome.code === 'deposit_received') return back('received');
  return back(PROBLEM_OF[outcome.kind] ?? 'refused');
};

/** The quote page words each problem (payments/deposit-state); anything else is a plain refusal. */
const PROBLEM_OF: Partial<Record<RefusalKind, string>> = { unavailable: 'unavailable', 'upstream-failed': 'provider-down' };
