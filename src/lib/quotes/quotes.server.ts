/**
 * What engineers and clients do to quotes: draft, edit while draft, render,
 * send, accept. Each action is one transaction; routes and pages only translate.
 */
import { and, eq, inArray, isNull, lt, ne, or } from 'drizzle-orm';
import { formatDate } from '../platform/format';
import { quoteTotals, withQuantity, type QuotePatch } from './pricing';
import { moveBrief } from '~/lib/briefs/index.server';
import { db } from '../platform/db';
import { brief, quote } from '../platform/db/schema';
import { isStaff, type SignedInUser } from '../platform/http/guard';
import { invalidInput, notYours, refuse, succeed, type Outcome } from '../platform/outcome';
import { appUrl } from '../platform/links';
import { mailer } from '../platform/mail/mailer';
import { renderQuotePdf } from './render.server';
import { draftQuote, moveQuote, validUntilFrom, writeLines, type QuoteRow } from './core.server';
import { quoteMail } from './mail.server';
import { loadQuoteView, type QuoteView } from './view.server';
import { DAY_MS } from '../platform/time';

const wrong = (message: string) => refuse('wrong-state', message);
const badDate = (message: string) => invalidInput('invalid_quote', [{ path: 'validUntil', message }]);

export const quotePageUrl = (id: string) => appUrl(`/quotes/${id}`);

/**
 * The quote if this viewer may see it, else null (answer 404): staff see
 * every quote; a client sees the quotes of their own briefs once sent.
 * `ownDrafts` lets an action on the client's own unsent quote answer 409
 * (not sent yet) rather than 404, without showing the draft's content.
 */
export async function findQuoteFor(viewer: SignedInUser, id: string, { ownDrafts = false } = {}): Promise<QuoteView | null> {
  const view = await loadQuoteView(db, id);
  if (!view) return null;
  if (isStaff(viewer)) return view;
  if (view.brief.ownerId !== viewer.id) return null;
  return view.quote.state !== 'draft' || ownDrafts ? view : null;
}

/** The same lookup as an outcome, for actions that continue with the quote. */
export async function quoteOf(
  viewer: SignedInUser,
  id: string | undefined,
  options: { ownDrafts?: boolean } = {},
): Promise<Outcome<QuoteView>> {
  const view = await findQuoteFor(viewer, id ?? '', options);
  return view ? succeed(view) : notYours();
}

export async function quotesOfBrief(briefId: string): Promise<QuoteRow[]> {
  return db.select().from(quote).where(eq(quote.briefId, briefId)).orderBy(quote.createdAt);
}

/** The newest quote of each brief (sent ones only unless `includeDrafts`), for list pages. */
export async function latestQuotes(briefIds: readonly string[], includeDrafts = false): Promise<Map<string, QuoteRow>> {
  if (briefIds.length === 0) return new Map();
  const rows = await db
    .select()
    .from(quote)
    .where(inArray(quote.briefId, [...briefIds]))
    .orderBy(quote.createdAt);
  const latest = new Map<string, QuoteRow>();
  for (const row of rows) if (includeDrafts || row.state !== 'draft') latest.set(row.briefId, row);
  return latest;
}

export function quoteJson(view: QuoteView) {
  const { quote: q } = view;
  return {
    id: q.id,
    number: q.number,
    state: view.state,
    briefId: view.brief.id,
    briefTitle: view.brief.title,
    revisionId: view.revision.id,
    revisionNumber: view.revision.number,
    currency: q.currency,
    quantity: q.quantity,
    taxRateBp: q.taxRateBp,
    depositBp: q.depositBp,
    subtotalMinor: q.subtotalMinor,
    taxMinor: q.taxMinor,
    totalMinor: q.totalMinor,
    depositMinor: q.depositMinor,
    terms: q.terms,
    validUntil: q.validUntil.toISOString(),
    sentAt: q.sentAt?.toISOString() ?? null,
    acceptedAt: q.acceptedAt?.toISOString() ?? null,
    createdAt: q.createdAt.toISOString(),
    client: view.client,
    lines: view.lines.map(({ kind, description, quantityMilli, unit, unitPriceMinor, totalMinor }) => ({
      kind,
      description,
      quantityMilli,
      unit,
      unitPriceMinor,
      totalMinor,
    })),
    requirements: view.requirements,
    design: view.design,
  };
}

export async function createQuote(staff: SignedInUser, revisionId: string, quantity: number): Promise<Outcome<QuoteView>> {
  const drafted = await draftQuote(db, { revisionId, createdBy: staff.id, quantity });
  if (!drafted.ok) return drafted;
  const view = await loadQuoteView(db, drafted.value.id);
  return view ? succeed(view) : refuse('not-found', 'The quote vanished after drafting; try again.');
}

/** A send that has not finished in this long is taken to have died (a crashed process); it may be retried. */
const SEND_CLAIM_MS = 120_000;
const notBeingSent = (now: Date) => or(isNull(quote.sendingSince), lt(quote.sendingSince, new Date(now.getTime() - SEND_CLAIM_MS)));

/** Edits a draft: lines, units, rates, validity, terms. Totals are recomputed here, never taken from the caller. */
export async function updateDraft(view: QuoteView, patch: QuotePatch, now = new Date()): Promise<Outcome<QuoteView>> {
  if (view.quote.state !== 'draft')
    return wrong(`Only a draft can be edited; this quote is ${view.state}. Draft a new quote to change it.`);
  let validUntil: Date | undefined;
  if (patch.validUntil !== undefined) {
    const day = new Date(`${patch.validUntil}T00:00:00Z`);
    if (Number.isNaN(day.getTime())) return badDate('That is not a calendar date.');
    validUntil = validUntilFrom(day, 0);
    if (validUntil.getTime() < now.getTime()) return badDate('The validity date must be today or later.');
    if (validUntil.getTime() - now.getTime() > 366 * DAY_MS) return badDate('Keep the validity within a year.');
  }
  const taxRateBp = patch.taxRateBp ?? view.quote.taxRateBp;
  const depositBp = patch.depositBp ?? view.quote.depositBp;
  const quantity = patch.quantity ?? view.quote.quantity;
  const baseLines =
    patch.lines ??
    view.lines.map(({ kind, description, quantityMilli, unit, unitPriceMinor }) => ({
      kind,
      description,
      quantityMilli,
      unit,
      unitPriceMinor,
    }));
  // Given lines are taken as written; a change of units alone rescales the per-unit lines.
  const lines = patch.quantity !== undefined && patch.lines === undefined ? withQuantity(baseLines, quantity) : baseLines;

  const updated = await db.transaction(async (tx) => {
    const [row] = await tx
      .update(quote)
      .set({
        quantity,
        taxRateBp,
        depositBp,
        ...quoteTotals(lines, taxRateBp, depositBp),
        ...(patch.terms !== undefined ? { terms: patch.terms.trim() } : {}),
        ...(validUntil ? { validUntil } : {}),
        updatedAt: now,
      })
      .where(and(eq(quote.id, view.quote.id), eq(quote.state, 'draft'), notBeingSent(now)))
      .returning();
    if (!row) return null;
    await writeLines(tx, row.id, lines, taxRateBp, depositBp);
    return row;
  });
  if (!updated) return wrong('The quote is being sent or was sent meanwhile; reload it.');
  return reload(updated.id);
}

async function reload(id: string): Promise<Outcome<QuoteView>> {
  const view = await loadQuoteView(db, id);
  return view ? succeed(view) : refuse('not-found', 'The quote no longer exists.');
}

export function quotePdf(view: QuoteView): Promise<Buffer> {
  return renderQuotePdf(view, { quoteUrl: quotePageUrl(view.quote.id) });
}

/**
 * Renders the PDF, e-mails it to the client, and only when the mail server
 * has taken the message marks the quote sent and the brief quoted. A failed
 * mail leaves the draft as it was (and logged) so sending can be retried.
 */
export async function sendQuote(view: QuoteView, staff: SignedInUser, now = new Date()): Promise<Outcome<QuoteView>> {
  if (view.quote.state !== 'draft') return wrong(`This quote is ${view.state} already; only a draft is sent.`);
  if (view.brief.state !== 'in-review')
    return wrong(`The brief is ${view.brief.state}; take it into review before sending a quote for it.`);
  if (view.quote.totalMinor <= 0) return wrong('The quote totals nothing; add priced lines before sending it.');
  if (view.quote.validUntil.getTime() < now.getTime())
    return wrong(`The validity date ${formatDate(view.quote.validUntil)} has passed; set a new one before sending.`);

  // Claim the send first: a second click or a second engineer gets a 409 rather than a second e-mail.
  const [claimed] = await db
    .update(quote)
    .set({ sendingSince: now })
    .where(and(eq(quote.id, view.quote.id), eq(quote.state, 'draft'), notBeingSent(now)))
    .returning({ id: quote.id });
  if (!claimed) return wrong('This quote is being sent right now; reload in a moment to see the outcome.');

  // Read again under the claim, so the PDF shows exactly what is stored as sent.
  const current = (await loadQuoteView(db, view.quote.id)) ?? view;
  const asSent: QuoteView = { ...current, state: 'sent', quote: { ...current.quote, state: 'sent', sentAt: now } };
  const mailed = await quotePdf(asSent)
    .then((pdf) => mailer.send(quoteMail(asSent, pdf, quotePageUrl(view.quote.id))))
    .catch((err: unknown) => ({ ok: false as const, error: err instanceof Error ? err.message : String(err) }));
  if (!mailed.ok) {
    await db.update(quote).set({ sendingSince: null }).where(eq(quote.id, view.quote.id));
    return refuse(
      'upstream-failed',
      `The e-mail to ${view.client.email} could not be sent (${mailed.error}). The quote is still a draft; try sending again.`,
      { code: 'mail_failed' },
    );
  }

  const marked = await db.transaction(async (tx) => {
    const sent = await moveQuote(tx, current.quote, 'sent', staff.id, { sentAt: now, sendingSince: null });
    if (!sent) return false;
    // One offer stands at a time: the brief's earlier sent quotes are withdrawn, so only this one can be accepted.
    const earlier = await tx
      .select()
      .from(quote)
      .where(and(eq(quote.briefId, view.brief.id), eq(quote.state, 'sent'), ne(quote.id, view.quote.id)));
    for (const old of earlier) await moveQuote(tx, old, 'withdrawn', staff.id, {}, `Replaced by quote ${view.quote.number}`, now);
    const [briefRow] = await tx.select().from(brief).where(eq(brief.id, view.brief.id)).limit(1);
    // The mail is out, so the quote is sent whatever happened to the brief meanwhile.
    if (briefRow) await moveBrief(tx, briefRow, 'quoted', 'system', staff.id, `Quote ${view.quote.number} sent`);
    return true;
  });
  if (!marked) return wrong('The quote was sent by someone else meanwhile; reload it.');
  return reload(view.quote.id);
}

class Refused extends Error {}

/** The client accepts a sent quote that is still valid; the brief moves to accepted with it. */
export async function acceptQuote(view: QuoteView, client: SignedInUser, now = new Date()): Promise<Outcome<QuoteView>> {
  if (view.brief.ownerId !== client.id) return refuse('not-found', 'Nothing here, or it is not yours.');
  if (view.quote.state === 'accepted' || view.quote.state === 'deposit-paid')
    return wrong(`Quote ${view.quote.number} is accepted already.`);
  if (view.quote.state === 'draft') return wrong('This quote has not been sent yet; it can be accepted once it reaches you.');
  if (view.quote.state !== 'sent') return wrong(`Quote ${view.quote.number} is ${view.state} and cannot be accepted.`);
  if (view.quote.validUntil.getTime() < now.getTime()) {
    return wrong(
      `Quote ${view.quote.number} expired on ${formatDate(view.quote.validUntil)}. Reply to the quote e-mail and we will send a fresh one.`,
    );
  }
  try {
    await db.transaction(async (tx) => {
      const accepted = await moveQuote(tx, view.quote, 'accepted', client.id, { acceptedAt: now });
      if (!accepted) throw new Refused(`Quote ${view.quote.number} was accepted meanwhile.`);
      const [briefRow] = await tx.select().from(brief).where(eq(brief.id, view.brief.id)).limit(1);
      const moved = briefRow ? await moveBrief(tx, briefRow, 'accepted', 'system', client.id, `Quote ${view.quote.number} accepted`) : null;
      if (!moved?.ok)
        throw new Refused('This quote no longer stands: the brief has moved on. Reply to the quote e-mail and we will sort it out.');
    });
  } catch (err) {
    if (err instanceof Refused) return wrong(err.message);
    throw err;
  }
  return reload(view.quote.id);
}

export type QuoteJson = ReturnType<typeof quoteJson>;
