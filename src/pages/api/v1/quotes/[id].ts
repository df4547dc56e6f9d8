import type { APIRoute } from 'astro';
import { patchQuoteSchema } from '~/lib/quotes/pricing';
import { ANY_ROLE, guardApi, STAFF } from '~/lib/platform/http/guard';
import { json, notFound } from '~/lib/platform/http/responses';
import { answer, findQuoteFor, quoteJson, updateDraft } from '~/lib/quotes/quotes.server';
import { parseBody } from '~/lib/platform/http/validation';

export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const view = await findQuoteFor(gate.user, context.params.id ?? '');
  return view ? json(quoteJson(view)) : notFound();
};

/** Edits a draft's lines, units, rates, validity and terms; the server prices it. */
export const PATCH: APIRoute = async (context) => {
  const body = await parseBody(context.request, patchQuoteSchema, 'invalid_quote');
  if (!body.ok) return body.response;
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  const view = await findQuoteFor(gate.user, context.params.id ?? '');
  if (!view) return notFound();
  return answer(await updateDraft(view, body.value), quoteJson);
};
