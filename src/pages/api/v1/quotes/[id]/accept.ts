import { apiMutation } from '~/lib/platform/http/mutation';
import { json } from '~/lib/platform/http/responses';
import { acceptQuoteSchema } from '~/lib/quotes/decisions';
import { acceptQuote, quoteJson, quoteOf } from '~/lib/quotes/quotes.server';

/** The owner client accepts a sent, unexpired quote, optionally with `{ purchaseOrder }`; staff read quotes but do not accept for clients. */
export const POST = apiMutation({
  access: ['client'],
  body: acceptQuoteSchema,
  bodyOptional: true,
  invalidCode: 'invalid_acceptance',
  run: async ({ user, body, context }) => {
    // Their own unsent quote answers "not sent yet" (409) rather than 404, without showing it.
    const found = await quoteOf(user, context.params.id, { ownDrafts: true });
    return found.ok ? acceptQuote(found.value, user, body) : found;
  },
  answer: (view) => json(quoteJson(view)),
});
