import type { APIRoute } from 'astro';
import { guardApi } from '~/lib/platform/http/guard';
import { notFound } from '~/lib/platform/http/responses';
import { acceptQuote, answer, findQuoteFor, quoteJson } from '~/lib/quotes/quotes.server';

/** The owner client accepts a sent, unexpired quote; staff read quotes but do not accept for clients. */
export const POST: APIRoute = async (context) => {
  const gate = guardApi(context, ['client']);
  if (!gate.ok) return gate.response;
  const view = await findQuoteFor(gate.user, context.params.id ?? '', { ownDrafts: true });
  if (!view) return notFound();
  return answer(await acceptQuote(view, gate.user), quoteJson);
};
