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
import { currentRevisions } from './current-design.server';

/** `fromRevisionId` starts the form from that revision's choices instead of the latest one's. */
export async function reviewPageData(row: BriefRow, fromRevisionId: string | null = null) {
  const [detail, revisions, notes, catalog, currency, current] = await Promise.all([
    briefDetail(row),
    listRevisions(row),
    listNotes(row.id),
    currentCatalog(),
    partsCurrency(),
    currentRevisions([row.id]).then((found) => found.get(row.id) ?? null),
  ]);
  const spec = railSpecSchema.safeParse(row.spec);
  // A link may name a revision; otherwise the review opens on the one the client was quoted, else the newest.
  const named = revisions.find((r) => r.id === fromRevisionId) ?? null;
  const base = named ?? revisions.find((r) => r.id === current?.id) ?? revisions[0] ?? null;
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
    current: current && { ...current, opened: base?.id === current.id },
    revisions: revisions.map((r) => ({
      id: r.id,
      number: r.number,
      topology: r.topology,
      feasible: r.feasible,
      note: r.note,
      createdAt: r.createdAt.toISOString(),
      author: r.author,
    })),
    linearClasses: catalog.linearRegulators.map((c) => ({ id: c.id, label: c.label })),
    currency,
    moves: movesFor(row.state, 'staff'),
  };
}
