import type { APIRoute } from 'astro';
import { guardApi, STAFF } from '~/lib/platform/http/guard';
import { notFound } from '~/lib/platform/http/responses';
import { answer, findQuoteFor, quoteJson, sendQuote } from '~/lib/quotes/quotes.server';

/** Renders the PDF, e-mails it to the client and marks the quote sent (502 when the mail fails). */
export const POST: APIRoute = async (context) => {
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  const view = await findQuoteFor(gate.user, context.params.id ?? '');
  if (!view) return notFound();
  return answer(await sendQuote(view, gate.user), quoteJson);
};
