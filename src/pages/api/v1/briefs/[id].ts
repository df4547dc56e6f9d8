import type { APIRoute } from 'astro';
import { clientBriefPatchSchema, staffBriefPatchSchema } from '~/lib/briefs/requests';
import { deleteDraft, editOwnBrief } from '~/lib/briefs/actions.server';
import { moveBriefAsStaff } from '~/lib/invoices/issue.server';
import { briefDetailJson, briefJson } from '~/lib/briefs/json';
import { briefDetail, briefOf, findBriefFor } from '~/lib/briefs/briefs.server';
import { ANY_ROLE, guardApi, isStaff, STAFF } from '~/lib/platform/http/guard';
import { apiMutation } from '~/lib/platform/http/mutation';
import { json, notFound } from '~/lib/platform/http/responses';
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
      .filter((q) => staff || q.state !== 'draft')
      .map((q) => ({
        id: q.id,
        number: q.number,
        state: q.state,
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

const staffMove = apiMutation({
  access: STAFF,
  body: staffBriefPatchSchema,
  run: async ({ user, body, context }) => {
    const found = await briefOf(user, context.params.id);
    return found.ok ? moveBriefAsStaff(user, found.value, body.state, body.note) : found;
  },
  answer: (row) => json(briefJson(row)),
});

const ownerEdit = apiMutation({
  access: ['client'],
  body: clientBriefPatchSchema,
  run: async ({ user, body, context }) => {
    const found = await briefOf(user, context.params.id);
    return found.ok ? editOwnBrief(user, found.value, body) : found;
  },
  answer: (row) => json(briefJson(row)),
});

/** Owners edit their drafts (or submit / cancel); staff move the state. */
export const PATCH: APIRoute = (context) => (isStaff(context.locals.user) ? staffMove(context) : ownerEdit(context));

/** The owner deletes a draft (204); a submitted brief is refused (409) and is withdrawn instead. */
export const DELETE = apiMutation({
  access: ['client'],
  run: async ({ user, context }) => {
    const found = await briefOf(user, context.params.id);
    return found.ok ? deleteDraft(user, found.value) : found;
  },
  answer: () => new Response(null, { status: 204 }),
});
