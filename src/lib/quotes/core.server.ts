/**
 * Drafting a quote from a design revision: lines priced from the rate card,
 * totals on the server, the next number of the year. Takes the database as an
 * argument (free of the app's settings) so the demo seed drafts quotes the
 * same way the quote builder does.
 */
import { invalidInput, refuse, succeed, type Outcome } from '../platform/outcome';
import { and, eq, sql } from 'drizzle-orm';
import type { RailSpec } from '../engine/rail-spec';
import type { Evaluation } from '../engine/types';
import { designFacts, draftLines, lineTotal, quoteTotals, type QuoteLineInput } from './pricing';
import { infeasibleDraftNote, infeasibleReasonFor } from './drafting';
import { chosenOption } from '~/lib/review';
import {
  brief,
  designRevision,
  quote,
  quoteLine,
  stateChange,
  type QuoteLineRow,
  type QuoteRow,
  type QuoteState,
} from '../platform/db/schema';
import type { DbOrTx } from '../platform/db/connect';
import { readRateCard } from './rate-card.server';
import { canMoveQuote } from './transitions';
import { DAY_MS } from '../platform/time';

export type { QuoteLineRow, QuoteRow };

/** Briefs a quote may be drafted for: under review, or quoted already and getting a new offer. */
export const QUOTABLE_BRIEF_STATES = new Set(['submitted', 'in-review', 'quoted']);

export const DEFAULT_TERMS = [
  'Prices are in the stated currency; shipping of the prototypes is charged at cost.',
  'The deposit is payable on acceptance; design work is scheduled once it is received. The balance is invoiced on delivery of the design pack (schematic, part list, calculation trace, test report).',
  'Part prices are estimates at the time of quoting and are confirmed at purchase; changes above 10 % are agreed with you first.',
  'A change to the brief after acceptance is quoted separately.',
].join('\n');

export function formatQuoteNumber(year: number, sequence: number): string {
  return `RW-${year}-${String(sequence).padStart(4, '0')}`;
}

/** The end of the UTC day `days` after `from`: a quote is good for the whole of its last day. */
export function validUntilFrom(from: Date, days: number): Date {
  const day = Date.UTC(from.getUTCFullYear(), from.getUTCMonth(), from.getUTCDate());
  return new Date(day + (days + 1) * DAY_MS - 1);
}

/** Writes a quote's lines (replacing any) and its totals, inside the caller's transaction. */
export async function writeLines(tx: DbOrTx, quoteId: string, lines: readonly QuoteLineInput[], taxRateBp: number, depositBp: number) {
  const totals = quoteTotals(lines, taxRateBp, depositBp);
  await tx.delete(quoteLine).where(eq(quoteLine.quoteId, quoteId));
  await tx.insert(quoteLine).values(lines.map((line, position) => ({ quoteId, position, ...line, totalMinor: lineTotal(line) })));
  return totals;
}

export interface DraftRequest {
  revisionId: string;
  createdBy: string;
  quantity?: number;
  /** Required when the revision's design does not meet the brief. */
  infeasibleReason?: string | undefined;
  now?: Date;
}

/**
 * Drafts a quote for a revision. One transaction: the number (next in the
 * year; the unique year+sequence index backs it), the quote, its lines and
 * the first state record.
 */
export async function draftQuote(db: DbOrTx, request: DraftRequest): Promise<Outcome<QuoteRow>> {
  const now = request.now ?? new Date();
  const quantity = request.quantity ?? 1;
  const [found] = await db
    .select({ revision: designRevision, briefState: brief.state })
    .from(designRevision)
    .innerJoin(brief, eq(brief.id, designRevision.briefId))
    .where(eq(designRevision.id, request.revisionId))
    .limit(1);
  if (!found) return refuse('not-found', 'No such design revision.');
  if (!QUOTABLE_BRIEF_STATES.has(found.briefState)) return refuse('wrong-state', `A brief that is ${found.briefState} cannot be quoted.`);
  const card = await readRateCard(db);
  if (!card) return refuse('wrong-state', 'There is no rate card yet; an admin sets one on the rate card page.');
  const revision = found.revision;
  const facts = designFacts({
    topology: revision.topology,
    number: revision.number,
    input: revision.input as RailSpec,
    result: revision.result as Evaluation,
  });
  if (!facts) return refuse('wrong-state', `Revision ${revision.number} holds no design for ${revision.topology}.`);
  const feasible = chosenOption({ topology: revision.topology, result: revision.result as Evaluation })?.feasible ?? false;
  const reasoned = infeasibleReasonFor({ number: revision.number, feasible }, request.infeasibleReason);
  if (!reasoned.ok) return invalidInput('invalid_quote', [reasoned.issue]);
  const lines = draftLines(card, facts, quantity);
  const year = now.getUTCFullYear();

  const created = await db.transaction(async (tx) => {
    const [last] = await tx
      .select({ n: sql<number>`coalesce(max(${quote.sequence}), 0)` })
      .from(quote)
      .where(eq(quote.year, year));
    const sequence = Number(last?.n ?? 0) + 1;
    const [inserted] = await tx
      .insert(quote)
      .values({
        briefId: revision.briefId,
        revisionId: revision.id,
        number: formatQuoteNumber(year, sequence),
        year,
        sequence,
        currency: card.currency,
        quantity,
        taxRateBp: card.taxRateBp,
        depositBp: card.depositBp,
        terms: DEFAULT_TERMS,
        infeasibleReason: reasoned.reason,
        validUntil: validUntilFrom(now, card.validityDays),
        createdBy: request.createdBy,
        createdAt: now,
        updatedAt: now,
      })
      .returning();
    if (!inserted) throw new Error('Insert returned no quote');
    const totals = await writeLines(tx, inserted.id, lines, card.taxRateBp, card.depositBp);
    const [priced] = await tx.update(quote).set(totals).where(eq(quote.id, inserted.id)).returning();
    await tx.insert(stateChange).values({
      subjectType: 'quote',
      subjectId: inserted.id,
      fromState: null,
      toState: 'draft',
      actorId: request.createdBy,
      note: reasoned.reason ? infeasibleDraftNote(revision.number, reasoned.reason) : '',
      createdAt: now,
    });
    return priced ?? inserted;
  });
  return succeed(created);
}

/** A quote's lines in their order. */
export async function quoteLines(db: DbOrTx, quoteId: string): Promise<QuoteLineRow[]> {
  return db.select().from(quoteLine).where(eq(quoteLine.quoteId, quoteId)).orderBy(quoteLine.position);
}

/** Moves a quote between states when the table allows it and it is still in the state read; records who did it. */
export async function moveQuote(
  tx: DbOrTx,
  row: QuoteRow,
  to: QuoteState,
  actorId: string | null,
  extra: Partial<typeof quote.$inferInsert> = {},
  note = '',
  at = new Date(),
) {
  if (!canMoveQuote(row.state, to)) return null;
  const [updated] = await tx
    .update(quote)
    .set({ state: to, updatedAt: at, ...extra })
    .where(and(eq(quote.id, row.id), eq(quote.state, row.state)))
    .returning();
  if (!updated) return null;
  await tx
    .insert(stateChange)
    .values({ subjectType: 'quote', subjectId: row.id, fromState: row.state, toState: to, actorId, note, createdAt: at });
  return updated;
}
