import type { APIRoute } from 'astro';
import { revisionRequestSchema } from '~/lib/review/requests';
import { findBriefFor } from '~/lib/briefs/briefs.server';
import { guardApi, STAFF } from '~/lib/platform/http/guard';
import { apiError, invalid, json, notFound } from '~/lib/platform/http/responses';
import { listRevisions, revisionJson, saveRevision } from '~/lib/review/revisions.server';
import { parseBody } from '~/lib/platform/http/validation';

export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  const row = await findBriefFor(gate.user, context.params.id ?? '');
  if (!row) return notFound();
  const items = await listRevisions(row);
  return json({ items: items.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })) });
};

export const POST: APIRoute = async (context) => {
  const body = await parseBody(context.request, revisionRequestSchema, 'invalid_revision');
  if (!body.ok) return body.response;
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  const row = await findBriefFor(gate.user, context.params.id ?? '');
  if (!row) return notFound();
  const saved = await saveRevision(row, gate.user.id, body.value);
  if (!saved.ok)
    return saved.status === 400 ? invalid(saved.error, saved.issues) : apiError(saved.status, 'wrong_state', { message: saved.message });
  return json(revisionJson(saved.value), 201);
};
