/** What the review page needs for its first paint, gathered from the lib modules (never over HTTP). */
import { evaluate, railSpecSchema, type TopologyId } from '../engine';
import { briefWithChoices } from './requests';
import { movesFor } from '~/lib/briefs';
import { formFrom } from './choices';
import { briefDetail, type BriefRow } from '~/lib/briefs/index.server';
import { currentCatalog } from '~/lib/catalog/index.server';
import { partsCurrency } from './exports.server';
import { listNotes } from '~/lib/briefs/index.server';
import { listRevisions } from './revisions.server';

/** `fromRevisionId` starts the form from that revision's choices instead of the latest one's. */
export async function reviewPageData(row: BriefRow, fromRevisionId: string | null = null) {
  const [detail, revisions, notes, catalog, currency] = await Promise.all([
    briefDetail(row),
    listRevisions(row),
    listNotes(row.id),
    currentCatalog(),
    partsCurrency(),
  ]);
  const spec = railSpecSchema.safeParse(row.spec);
  const base = revisions.find((r) => r.id === fromRevisionId) ?? revisions[0] ?? null;
  const weights = (base?.weights ?? (spec.success ? spec.data.weights : {})) as Record<string, unknown>;
  const overrides = (base?.overrides ?? {}) as Record<string, unknown>;
  const requirement = base?.requirement ?? {};
  // Start from that revision's choices, re-run on today's catalog, so a re-run changes only what the engineer changes.
  const start = spec.success ? briefWithChoices(row.spec, { weights, overrides, requirement }) : null;
  const result = start?.success ? evaluate(start.data, catalog) : null;
  return {
    detail,
    notes,
    spec: spec.success ? spec.data : null,
    result,
    form: formFrom(weights, overrides, requirement),
    topology: (base?.topology as TopologyId | undefined) ?? null,
    startedFrom: base?.number ?? null,
    revisions: revisions.map((r) => ({
      id: r.id,
      number: r.number,
      topology: r.topology,
      note: r.note,
      createdAt: r.createdAt.toISOString(),
      author: r.author,
    })),
    linearClasses: catalog.linearRegulators.map((c) => ({ id: c.id, label: c.label })),
    currency,
    moves: movesFor(row.state, 'staff'),
  };
}
