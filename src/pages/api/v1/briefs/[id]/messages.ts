import type { APIRoute } from 'astro';
import { briefOf, findBriefFor } from '~/lib/briefs/briefs.server';
import { listMessages, messageJson, postMessage } from '~/lib/briefs/messages.server';
import { messageRequestSchema } from '~/lib/briefs/requests';
import { ANY_ROLE, guardApi } from '~/lib/platform/http/guard';
import { apiMutation } from '~/lib/platform/http/mutation';
import { json, notFound } from '~/lib/platform/http/responses';

/** The brief's thread with its client: the owner and staff read it; another client gets 404. */
export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const row = await findBriefFor(gate.user, context.params.id ?? '');
  if (!row) return notFound();
  return json({ items: (await listMessages(row.id)).map(messageJson) });
};

export const POST = apiMutation({
  access: ANY_ROLE,
  body: messageRequestSchema,
  invalidCode: 'invalid_message',
  run: async ({ user, body, context }) => {
    const found = await briefOf(user, context.params.id);
    return found.ok ? postMessage(found.value, user, body) : found;
  },
  answer: (message) => json(messageJson(message), 201),
});
