/**
 * The design a brief stands on now: the revision its newest sent or accepted quote was built
 * from, else its newest revision. The review opens on it; the desk shows its figures.
 */
import { desc, inArray, and } from 'drizzle-orm';
import type { Evaluation } from '../engine';
import { summarise, type BriefSummary } from '~/lib/briefs';
import type { briefListJson } from '~/lib/briefs/index.server';
import { db } from '../platform/db';
import { designRevision, quote, type QuoteState } from '../platform/db/schema';

/** Quotes the client has been given: the design they were built from is the one promised. */
const QUOTED_STATES: QuoteState[] = ['sent', 'accepted', 'deposit-paid'];

interface RevisionRef {
  id: string;
  number: number;
}

export interface CurrentRevision extends RevisionRef {
  /** The quote this revision was built from, when that is why it is current. */
  quote: { number: string; state: QuoteState } | null;
  newest: RevisionRef;
}

/** For each brief with a revision, the current one (see above) and the newest. */
export async function currentRevisions(briefIds: readonly string[]): Promise<Map<string, CurrentRevision>> {
  const found = new Map<string, CurrentRevision>();
  if (briefIds.length === 0) return found;
  const [revisions, quotes] = await Promise.all([
    db
      .select({ id: designRevision.id, briefId: designRevision.briefId, number: designRevision.number })
      .from(designRevision)
      .where(inArray(designRevision.briefId, [...briefIds]))
      .orderBy(desc(designRevision.number)),
    db
      .select({ briefId: quote.briefId, revisionId: quote.revisionId, number: quote.number, state: quote.state })
      .from(quote)
      .where(and(inArray(quote.briefId, [...briefIds]), inArray(quote.state, QUOTED_STATES)))
      .orderBy(desc(quote.sentAt), desc(quote.sequence)),
  ]);
  const byId = new Map(revisions.map((r) => [r.id, r]));
  for (const r of revisions) {
    if (found.has(r.briefId)) continue;
    const newest = { id: r.id, number: r.number };
    const quoted = quotes.find((q) => q.briefId === r.briefId && byId.has(q.revisionId));
    const revision = quoted ? byId.get(quoted.revisionId) : undefined;
    found.set(
      r.briefId,
      revision && quoted
        ? { id: revision.id, number: revision.number, quote: { number: quoted.number, state: quoted.state }, newest }
        : { ...newest, quote: null, newest },
    );
  }
  return found;
}

type BriefPage = ReturnType<typeof briefListJson>;

/** The desk's figures for a page of briefs: the current design's, or the engine's pick at submission where none was saved. */
export async function withCurrentDesigns(page: BriefPage) {
  const current = await currentRevisions(page.items.map((i) => i.id));
  const ids = [...current.values()].map((c) => c.id);
  const stored =
    ids.length === 0
      ? []
      : await db
          .select({ id: designRevision.id, topology: designRevision.topology, result: designRevision.result })
          .from(designRevision)
          .where(inArray(designRevision.id, ids));
  const results = new Map(stored.map((r) => [r.id, r]));
  return {
    ...page,
    items: page.items.map((item) => {
      const revision = current.get(item.id);
      const saved = revision ? results.get(revision.id) : undefined;
      const summary: BriefSummary | null = saved ? summarise(saved.result as Evaluation, saved.topology) : item.summary;
      const design = revision ? { revision: revision.number, quoted: revision.quote !== null } : null;
      return { ...item, summary, design };
    }),
  };
}

export type DeskPage = Awaited<ReturnType<typeof withCurrentDesigns>>;
