import { and, desc, eq, sql } from 'drizzle-orm';
import { railSpecIssues, evaluate, type Evaluation } from '../engine';
import { briefWithChoices, type RevisionRequest } from './requests';
import { agreedRequirementOf } from './agreed-requirement';
import type { BriefRow } from '~/lib/briefs/index.server';
import { currentCatalog } from '~/lib/catalog/index.server';
import { db } from '../platform/db';
import { designRevision, user, type RevisionRow } from '../platform/db/schema';
import { invalidInput, refuse, succeed, type Outcome } from '../platform/outcome';

export type { RevisionRow };

/** Briefs an engineer may design for: submitted onwards, not closed. */
const DESIGNABLE = new Set(['submitted', 'in-review', 'quoted', 'accepted', 'deposit-paid', 'in-design']);

/**
 * Re-runs the engine with the engineer's choices and stores inputs and the
 * full result, so a revision reads the same forever, whatever the catalog becomes.
 */
export async function saveRevision(row: BriefRow, authorId: string, request: RevisionRequest): Promise<Outcome<RevisionRow>> {
  if (!DESIGNABLE.has(row.state)) return refuse('wrong-state', `A brief that is ${row.state} takes no new revisions.`);
  const parsed = briefWithChoices(row.spec, request);
  if (!parsed.success) return invalidInput('invalid_revision', railSpecIssues(parsed.error));
  const result: Evaluation = evaluate(parsed.data, await currentCatalog());
  const topology = request.topology ?? result.recommended ?? result.options[0]?.topology;
  if (!topology) return invalidInput('invalid_revision', [{ path: 'topology', message: 'No option to choose.' }]);

  const saved = await db.transaction(async (tx) => {
    const [last] = await tx
      .select({ n: sql<number>`coalesce(max(${designRevision.number}), 0)` })
      .from(designRevision)
      .where(eq(designRevision.briefId, row.id));
    const [inserted] = await tx
      .insert(designRevision)
      .values({
        briefId: row.id,
        number: Number(last?.n ?? 0) + 1,
        authorId,
        topology,
        weights: parsed.data.weights,
        overrides: parsed.data.overrides,
        input: parsed.data,
        result,
        note: request.note,
      })
      .returning();
    if (!inserted) throw new Error('Insert returned no row');
    return inserted;
  });
  return succeed(saved);
}

/** A brief's revisions, newest first, each with whether its chosen design is feasible and the requirement it was designed to where that departs from the brief. */
export async function listRevisions(row: Pick<BriefRow, 'id' | 'spec'>) {
  const rows = await db
    .select({
      id: designRevision.id,
      number: designRevision.number,
      topology: designRevision.topology,
      note: designRevision.note,
      createdAt: designRevision.createdAt,
      author: user.name,
      weights: designRevision.weights,
      overrides: designRevision.overrides,
      input: designRevision.input,
      // The chosen option's feasibility, read inside the stored result so the whole result is not loaded.
      feasible: sql<
        number | null
      >`(select json_extract(o.value, '$.feasible') from json_each(${designRevision.result}, '$.options') o where json_extract(o.value, '$.topology') = ${designRevision.topology})`,
    })
    .from(designRevision)
    .leftJoin(user, eq(user.id, designRevision.authorId))
    .where(eq(designRevision.briefId, row.id))
    .orderBy(desc(designRevision.number));
  return rows.map(({ input, feasible, ...r }) => ({ ...r, feasible: feasible === 1, requirement: agreedRequirementOf(row.spec, input) }));
}

export async function findRevision(briefId: string, revisionId: string): Promise<RevisionRow | null> {
  const [row] = await db
    .select()
    .from(designRevision)
    .where(and(eq(designRevision.briefId, briefId), eq(designRevision.id, revisionId)))
    .limit(1);
  return row ?? null;
}

export function revisionJson(row: RevisionRow) {
  return {
    id: row.id,
    briefId: row.briefId,
    number: row.number,
    topology: row.topology,
    weights: row.weights,
    overrides: row.overrides,
    note: row.note,
    input: row.input,
    result: row.result,
    createdAt: row.createdAt.toISOString(),
  };
}
