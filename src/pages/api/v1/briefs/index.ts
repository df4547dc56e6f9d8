import type { APIRoute } from 'astro';
import { briefListQuerySchema, createBriefSchema } from '~/lib/briefs/requests';
import { createBrief } from '~/lib/briefs/actions.server';
import { briefJson } from '~/lib/briefs/json';
import { briefListJson, listBriefs } from '~/lib/briefs/briefs.server';
import { ANY_ROLE, guardApi } from '~/lib/platform/http/guard';
import { apiError, invalid, json } from '~/lib/platform/http/responses';
import { parseBody, zodIssues } from '~/lib/platform/http/validation';

export const GET: APIRoute = async (context) => {
  const query = briefListQuerySchema.safeParse(Object.fromEntries(context.url.searchParams));
  if (!query.success) return invalid('invalid_query', zodIssues(query.error));
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const { status, q, client, page, pageSize, sort } = query.data;
  const list = await listBriefs(gate.user, { status, q, ownerId: client, page, pageSize, sort });
  return json(briefListJson(list));
};

export const POST: APIRoute = async (context) => {
  const body = await parseBody(context.request, createBriefSchema);
  if (!body.ok) return body.response;
  const gate = guardApi(context, ['client']);
  if (!gate.ok) return gate.response;
  const created = await createBrief(gate.user, body.value);
  if (!created.ok)
    return created.status === 400
      ? invalid(created.error, created.issues)
      : apiError(created.status, 'wrong_state', { message: created.message });
  return json(briefJson(created.value), 201, { location: `/api/v1/briefs/${created.value.id}` });
};
