import type { APIRoute } from 'astro';
import { revisionRequestSchema } from '~/lib/review/requests';
import { briefOf, findBriefFor } from '~/lib/briefs/briefs.server';
import { apiMutation } from '~/lib/platform/http/mutation';
import { guardApi, STAFF } from '~/lib/platform/http/guard';
import { json, notFound } from '~/lib/platform/http/responses';
import { listRevisions, revisionJson, saveRevision } from '~/lib/review/revisions.server';

export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  const row = await findBriefFor(gate.user, context.params.id ?? '');
  if (!row) return notFound();
  const items = await listRevisions(row);
  return json({ items: items.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })) });
};

export const POST = apiMutation({
  access: STAFF,
  body: revisionRequestSchema,
  invalidCode: 'invalid_revision',
  run: async ({ user, body, context }) => {
    const found = await briefOf(user, context.params.id);
    return found.ok ? saveRevision(found.value, user.id, body) : found;
  },
  answer: (revision) => json(revisionJson(revision), 201),
});
