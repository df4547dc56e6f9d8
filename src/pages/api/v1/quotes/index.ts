import type { APIRoute } from 'astro';
import { createQuoteSchema } from '~/lib/quotes/pricing';
import { ANY_ROLE, guardApi, STAFF } from '~/lib/platform/http/guard';
import { apiMutation } from '~/lib/platform/http/mutation';
import { invalid, json } from '~/lib/platform/http/responses';
import { zodIssues } from '~/lib/platform/http/validation';
import { createQuote, quoteJson } from '~/lib/quotes/quotes.server';
import { listQuotes } from '~/lib/quotes/list.server';
import { quoteListQuerySchema } from '~/lib/quotes/list-query';

/** Quotes one page at a time: staff see every quote, a client the sent quotes of their own briefs. */
export const GET: APIRoute = async (context) => {
  const query = quoteListQuerySchema.safeParse(Object.fromEntries(context.url.searchParams));
  if (!query.success) return invalid('invalid_query', zodIssues(query.error));
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  return json(await listQuotes(gate.user, query.data));
};

/** Drafts a priced quote from a design revision. */
export const POST = apiMutation({
  access: STAFF,
  body: createQuoteSchema,
  invalidCode: 'invalid_quote',
  run: ({ user, body }) => createQuote(user, body.revisionId, body.quantity, body.infeasibleReason),
  answer: (view) => json(quoteJson(view, { internal: true }), 201),
});
