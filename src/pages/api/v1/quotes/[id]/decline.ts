import { apiMutation } from '~/lib/platform/http/mutation';
import { json } from '~/lib/platform/http/responses';
import { declineQuoteSchema } from '~/lib/quotes/decisions';
import { declineQuote, quoteJson, quoteOf } from '~/lib/quotes/quotes.server';

/** The owner client declines a sent, unexpired quote with `{ reason }`; the engineer is told by e-mail. */
export const POST = apiMutation({
  access: ['client'],
  body: declineQuoteSchema,
  invalidCode: 'invalid_decline',
  run: async ({ user, body, context }) => {
    const found = await quoteOf(user, context.params.id, { ownDrafts: true });
    return found.ok ? declineQuote(found.value, user, body) : found;
  },
  answer: (view) => json(quoteJson(view)),
});
