import type { APIRoute } from 'astro';
import { briefListQuerySchema, createBriefSchema } from '~/lib/briefs/requests';
import { createBrief } from '~/lib/briefs/actions.server';
import { briefJson } from '~/lib/briefs/json';
import { briefListJson, listBriefs } from '~/lib/briefs/briefs.server';
import { ANY_ROLE, guardApi, isStaff } from '~/lib/platform/http/guard';
import { withCurrentDesigns } from '~/lib/review/current-design.server';
import { apiMutation } from '~/lib/platform/http/mutation';
import { invalid, json } from '~/lib/platform/http/responses';
import { zodIssues } from '~/lib/platform/http/validation';

export const GET: APIRoute = async (context) => {
  const query = briefListQuerySchema.safeParse(Object.fromEntries(context.url.searchParams));
  if (!query.success) return invalid('invalid_query', zodIssues(query.error));
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const { state, q, client, page, pageSize, sort } = query.data;
  const list = await listBriefs(gate.user, { state, q, ownerId: client, page, pageSize, sort });
  // Staff see each brief's current design; a client's list keeps the figures of what they submitted.
  return json(isStaff(gate.user) ? await withCurrentDesigns(briefListJson(list)) : briefListJson(list));
};

export const POST = apiMutation({
  access: ['client'],
  body: createBriefSchema,
  run: ({ user, body }) => createBrief(user, body),
  answer: (row) => json(briefJson(row), 201, { location: `/api/v1/briefs/${row.id}` }),
});
