import type { APIRoute } from 'astro';
import { clientBriefPatchSchema, staffBriefPatchSchema } from '~/lib/briefs/requests';
import { editOwnBrief, moveAsStaff, type ActionResult } from '~/lib/briefs/actions.server';
import { briefDetailJson, briefJson } from '~/lib/briefs/json';
import { briefDetail, findBriefFor, type BriefRow } from '~/lib/briefs/briefs.server';
import { ANY_ROLE, guardApi, isStaff } from '~/lib/platform/http/guard';
import { apiError, invalid, json, notFound, readJson } from '~/lib/platform/http/responses';
import { zodIssues } from '~/lib/platform/http/validation';
import { quotesOfBrief } from '~/lib/quotes/quotes.server';
import { listRevisions } from '~/lib/review/revisions.server';

export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const row = await findBriefFor(gate.user, context.params.id ?? '');
  if (!row) return notFound();
  const staff = isStaff(gate.user);
  const [detail, quotes, revisions] = await Promise.all([
    briefDetail(row),
    quotesOfBrief(row.id),
    staff ? listRevisions(row) : Promise.resolve([]),
  ]);
  return json({
    ...briefDetailJson(detail),
    // Clients see a quote once it is sent; drafts stay with the consultancy.
    quotes: quotes
      .filter((q) => staff || q.status !== 'draft')
      .map((q) => ({
        id: q.id,
        number: q.number,
        status: q.status,
        currency: q.currency,
        totalMinor: q.totalMinor,
        depositMinor: q.depositMinor,
        sentAt: q.sentAt?.toISOString() ?? null,
      })),
    ...(staff
      ? {
          revisions: revisions.map((r) => ({
            id: r.id,
            number: r.number,
            topology: r.topology,
            note: r.note,
            author: r.author,
            createdAt: r.createdAt.toISOString(),
          })),
        }
      : {}),
  });
};

function answer(result: ActionResult<BriefRow>): Response {
  if (result.ok) return json(briefJson(result.value));
  if (result.status === 400) return invalid(result.error, result.issues);
  return apiError(result.status, result.status === 409 ? 'wrong_state' : 'forbidden', { message: result.message });
}

/** Owners edit their drafts (or submit / cancel); staff move the state. */
export const PATCH: APIRoute = async (context) => {
  const body = await readJson(context.request);
  if (!body.ok) return body.response;
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const row = await findBriefFor(gate.user, context.params.id ?? '');
  if (!row) return notFound();

  if (isStaff(gate.user)) {
    const parsed = staffBriefPatchSchema.safeParse(body.value);
    if (!parsed.success) return invalid('invalid_body', zodIssues(parsed.error));
    return answer(await moveAsStaff(gate.user, row, parsed.data.status, parsed.data.note));
  }
  const parsed = clientBriefPatchSchema.safeParse(body.value);
  if (!parsed.success) return invalid('invalid_body', zodIssues(parsed.error));
  return answer(await editOwnBrief(gate.user, row, parsed.data));
};
