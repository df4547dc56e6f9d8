import { STAFF } from '~/lib/platform/http/guard';
import { apiMutation } from '~/lib/platform/http/mutation';
import { json } from '~/lib/platform/http/responses';
import { quoteJson, quoteOf, sendQuote } from '~/lib/quotes/quotes.server';

/** Renders the PDF, marks the quote sent and queues its e-mail with the PDF; the outbox delivers and retries it. */
export const POST = apiMutation({
  access: STAFF,
  run: async ({ user, context }) => {
    const found = await quoteOf(user, context.params.id);
    return found.ok ? sendQuote(found.value, user) : found;
  },
  answer: (view) => json(quoteJson(view, { internal: true })),
});
