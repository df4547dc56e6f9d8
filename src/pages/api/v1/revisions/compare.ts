import type { APIRoute } from 'astro';
import { guardApi, STAFF } from '~/lib/platform/http/guard';
import { invalid, json, refusalResponse } from '~/lib/platform/http/responses';
import { compareQuerySchema, compareRevisions } from '~/lib/review/revision-compare.server';
import { zodIssues } from '~/lib/platform/http/validation';

/** What changed between two revisions of a brief: inputs and the chosen options' key figures. */
export const GET: APIRoute = async (context) => {
  const query = compareQuerySchema.safeParse(Object.fromEntries(context.url.searchParams));
  if (!query.success) return invalid('invalid_query', zodIssues(query.error));
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  const compared = await compareRevisions(query.data.a, query.data.b);
  return compared.ok ? json(compared.value) : refusalResponse(compared);
};
