import { createQuoteSchema } from '~/lib/quotes/pricing';
import { STAFF } from '~/lib/platform/http/guard';
import { apiMutation } from '~/lib/platform/http/mutation';
import { json } from '~/lib/platform/http/responses';
import { createQuote, quoteJson } from '~/lib/quotes/quotes.server';

/** Drafts a priced quote from a design revision. */
export const POST = apiMutation({
  access: STAFF,
  body: createQuoteSchema,
  invalidCode: 'invalid_quote',
  run: ({ user, body }) => createQuote(user, body.revisionId, body.quantity),
  answer: (view) => json(quoteJson(view), 201),
});
