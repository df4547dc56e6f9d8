import type { APIRoute } from 'astro';
import { createQuoteSchema } from '~/lib/quotes/pricing';
import { guardApi, STAFF } from '~/lib/platform/http/guard';
import { answer, createQuote, quoteJson } from '~/lib/quotes/quotes.server';
import { parseBody } from '~/lib/platform/http/validation';

/** Drafts a priced quote from a design revision. */
export const POST: APIRoute = async (context) => {
  const body = await parseBody(context.request, createQuoteSchema, 'invalid_quote');
  if (!body.ok) return body.response;
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  return answer(await createQuote(gate.user, body.value.revisionId, body.value.quantity), quoteJson, 201);
};
