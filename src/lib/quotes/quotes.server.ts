/**
 * What engineers and clients do to quotes: draft, edit while draft, render,
 * send, accept. Each action is one transaction; routes and pages only translate.
 */
import { and, eq, inArray, ne } from 'drizzle-orm';
import { formatDate, formatDateTime } from '../platform/format';
import { quoteTotals, withQuantity, type QuotePatch } from './pricing';
import { moveBrief } from '~/lib/briefs/index.server';
import { db } from '../platform/db';
import { brief, quote, stateChange, user } from '../platform/db/schema';
import { isStaff, type SignedInUser } from '../platform/http/guard';
import { invalidInput, notYours, refuse, succeed, type Outcome, type Refusal } from '../platform/outcome';
import { appUrl } from '../platform/links';
import { deliverQueuedMail } from '../platform/mail/mailer';
import { enqueueMail, latestOutboxEntry } from '../platform/mail/outbox';
import { renderQuotePdf } from './render.server';
import { draftQuote, moveQuote, validUntilFrom, writeLines, type QuoteRow } from './core.server';
import { acceptedMail, declinedMail, quoteMail } from './mail.server';
import type { DbOrTx } from '../platform/db/connect';
import type { AcceptQuoteRequest, DeclineQuoteRequest } from './decisions';
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

/** A quote's moves, oldest first, with who made them and why: for the consultancy's quote page. */
export async function quoteHistory(quoteId: string) {
  return db
    .select({ from: stateChange.fromState, to: stateChange.toState, at: stateChange.createdAt, by: user.name, note: stateChange.note })
    .from(stateChange)
    .leftJoin(user, eq(user.id, stateChange.actorId))
    .where(and(eq(stateChange.subjectType, 'quote'), eq(stateChange.subjectId, quoteId)))
    .orderBy(stateChange.createdAt);
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

/** A quote as JSON; `internal` (staff only) adds what the client never sees: why an infeasible design was quoted. */
export function quoteJson(view: QuoteView, { internal = false } = {}) {
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
    clientNote: q.clientNote,
    ...(internal ? { infeasibleReason: q.infeasibleReason } : {}),
    validUntil: q.validUntil.toISOString(),
    sentAt: q.sentAt?.toISOString() ?? null,
    acceptedAt: q.acceptedAt?.toISOString() ?? null,
    purchaseOrder: q.purchaseOrder,
    declineReason: q.declineReason,
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

export async function createQuote(
  staff: SignedInUser,
  revisionId: string,
  quantity: number,
  infeasibleReason?: string,
): Promise<Outcome<QuoteView>> {
  const drafted = await draftQuote(db, { revisionId, createdBy: staff.id, quantity, infeasibleReason });
  if (!drafted.ok) return drafted;
  const view = await loadQuoteView(db, drafted.value.id);
  return view ? succeed(view) : refuse('not-found', 'The quote vanished after drafting; try again.');
}

/** Edits a draft: lines, units, rates, validity, terms, the note to the client. Totals are recomputed here, never taken from the caller. */
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
        ...(patch.clientNote !== undefined ? { clientNote: patch.clientNote.trim() } : {}),
        ...(validUntil ? { validUntil } : {}),
        updatedAt: now,
      })
      .where(and(eq(quote.id, view.quote.id), eq(quote.state, 'draft')))
      .returning();
    if (!row) return null;
    await writeLines(tx, row.id, lines, taxRateBp, depositBp);
    return row;
  });
  if (!updated) return wrong('The quote was sent meanwhile; reload it.');
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
 * Renders the PDF as it will be stored, then in one transaction marks the
 * quote sent, withdraws the brief's earlier offers, moves the brief to quoted
 * and queues the e-mail with the PDF (the outbox delivers and retries it), so
 * no crash can leave a sent quote without its mail or a mail without its quote.
 */
export async function sendQuote(view: QuoteView, staff: SignedInUser, now = new Date()): Promise<Outcome<QuoteView>> {
  if (view.quote.state !== 'draft') return wrong(`This quote is ${view.state} already; only a draft is sent.`);
  if (view.brief.state !== 'in-review')
    return wrong(`The brief is ${view.brief.state}; take it into review before sending a quote for it.`);
  if (view.quote.totalMinor <= 0) return wrong('The quote totals nothing; add priced lines before sending it.');
  if (view.quote.validUntil.getTime() < now.getTime())
    return wrong(`The validity date ${formatDate(view.quote.validUntil)} has passed; set a new one before sending.`);

  const asSent: QuoteView = { ...view, state: 'sent', quote: { ...view.quote, state: 'sent', sentAt: now } };
  const pdf = await quotePdf(asSent);
  let queued: string[];
  try {
    queued = await db.transaction(async (tx) => {
      // The PDF shows the draft as read: an edit since then means sending again, not mailing stale figures.
      const [stored] = await tx.select({ updatedAt: quote.updatedAt }).from(quote).where(eq(quote.id, view.quote.id)).limit(1);
      if (stored?.updatedAt.getTime() !== view.quote.updatedAt.getTime())
        throw new Refused('The quote changed while it was being sent; check it and send it again.');
      const sent = await moveQuote(tx, view.quote, 'sent', staff.id, { sentAt: now }, '', now);
      if (!sent) throw new Refused('The quote was sent by someone else meanwhile; reload it.');
      // One offer stands at a time: the brief's earlier sent quotes are withdrawn, so only this one can be accepted.
      const earlier = await tx
        .select()
        .from(quote)
        .where(and(eq(quote.briefId, view.brief.id), eq(quote.state, 'sent'), ne(quote.id, view.quote.id)));
      for (const old of earlier) await moveQuote(tx, old, 'withdrawn', staff.id, {}, `Replaced by quote ${view.quote.number}`, now);
      const [briefRow] = await tx.select().from(brief).where(eq(brief.id, view.brief.id)).limit(1);
      const moved = briefRow ? await moveBrief(tx, briefRow, 'quoted', 'system', staff.id, `Quote ${view.quote.number} sent`) : null;
      if (!moved?.ok) throw new Refused('The brief moved on meanwhile; reload it before sending.');
      return enqueueMail(tx, [quoteMail(asSent, pdf, quotePageUrl(view.quote.id))], now);
    });
  } catch (err) {
    if (err instanceof Refused) return wrong(err.message);
    throw err;
  }
  // Deliver now while the engineer waits; what the mail server refuses stays queued and is retried.
  await deliverQueuedMail(queued);
  return reload(view.quote.id);
}

/** Whether a sent quote's e-mail reached the mail server, in words for the builder. */
export async function quoteMailDelivery(quoteId: string): Promise<{ delivered: boolean; message: string } | null> {
  const entry = await latestOutboxEntry(db, quoteId, 'quote');
  if (!entry) return null;
  if (entry.state === 'sent')
    return { delivered: true, message: `E-mailed to ${entry.toAddress} on ${formatDateTime(entry.sentAt ?? entry.createdAt)}.` };
  const reason = entry.lastError ? ` (${entry.lastError})` : '';
  if (entry.state === 'failed')
    return {
      delivered: false,
      message: `The e-mail to ${entry.toAddress} could not be delivered after ${entry.attempts} tries${reason}. Check the address and reach the client another way.`,
    };
  return {
    delivered: false,
    message: `The e-mail to ${entry.toAddress} has not gone out yet${reason}. It is retried automatically; the next try is at ${formatDateTime(entry.nextAttemptAt)}.`,
  };
}

class Refused extends Error {}

/** The engineer who drafted the quote: the one told of the client's decision. */
async function quoteAuthor(tx: DbOrTx, view: QuoteView) {
  const [engineer] = await tx.select({ name: user.name, email: user.email }).from(user).where(eq(user.id, view.quote.createdBy)).limit(1);
  return engineer ?? null;
}

/** Why a client cannot decide on this quote now (accept or decline), or null when they can. */
function undecidable(view: QuoteView, client: SignedInUser, verb: 'accepted' | 'declined', now: Date): Refusal | null {
  const { quote: q } = view;
  if (view.brief.ownerId !== client.id) return notYours();
  if (q.state === 'accepted' || q.state === 'deposit-paid') return wrong(`Quote ${q.number} is accepted already.`);
  if (q.state === 'declined') return wrong(`Quote ${q.number} is declined already.`);
  if (q.state === 'draft') return wrong(`This quote has not been sent yet; it can be ${verb} once it reaches you.`);
  if (q.state !== 'sent') return wrong(`Quote ${q.number} is ${view.state} and cannot be ${verb}.`);
  if (q.validUntil.getTime() < now.getTime())
    return wrong(`Quote ${q.number} expired on ${formatDate(q.validUntil)}. Reply to the quote e-mail and we will send a fresh one.`);
  return null;
}

/** The client accepts a sent quote that is still valid, with their purchase-order number if they give one; the brief moves to accepted with it. */
export async function acceptQuote(
  view: QuoteView,
  client: SignedInUser,
  request: AcceptQuoteRequest = {},
  now = new Date(),
): Promise<Outcome<QuoteView>> {
  const refused = undecidable(view, client, 'accepted', now);
  if (refused) return refused;
  const purchaseOrder = request.purchaseOrder?.trim() || null;
  let queued: string[];
  try {
    queued = await db.transaction(async (tx) => {
      const accepted = await moveQuote(tx, view.quote, 'accepted', client.id, { acceptedAt: now, purchaseOrder });
      if (!accepted) throw new Refused(`Quote ${view.quote.number} was accepted meanwhile.`);
      const [briefRow] = await tx.select().from(brief).where(eq(brief.id, view.brief.id)).limit(1);
      const moved = briefRow ? await moveBrief(tx, briefRow, 'accepted', 'system', client.id, `Quote ${view.quote.number} accepted`) : null;
      if (!moved?.ok)
        throw new Refused('This quote no longer stands: the brief has moved on. Reply to the quote e-mail and we will sort it out.');
      const engineer = await quoteAuthor(tx, view);
      return engineer ? enqueueMail(tx, [acceptedMail(view, engineer, purchaseOrder, quotePageUrl(view.quote.id))], now) : [];
    });
  } catch (err) {
    if (err instanceof Refused) return wrong(err.message);
    throw err;
  }
  await deliverQueuedMail(queued);
  return reload(view.quote.id);
}

/**
 * The client declines a sent quote with their reason: the quote ends declined, the brief goes back
 * to review (the engineer revises and quotes again, or declines the brief), and the engineer who
 * drafted the quote is told in the same transaction through the outbox.
 */
export async function declineQuote(
  view: QuoteView,
  client: SignedInUser,
  request: DeclineQuoteRequest,
  now = new Date(),
): Promise<Outcome<QuoteView>> {
  const refused = undecidable(view, client, 'declined', now);
  if (refused) return refused;
  const reason = request.reason.trim();
  let queued: string[];
  try {
    queued = await db.transaction(async (tx) => {
      const declined = await moveQuote(tx, view.quote, 'declined', client.id, { declineReason: reason }, reason, now);
      if (!declined) throw new Refused(`Quote ${view.quote.number} changed meanwhile; reload it.`);
      const [briefRow] = await tx.select().from(brief).where(eq(brief.id, view.brief.id)).limit(1);
      const moved = briefRow
        ? await moveBrief(tx, briefRow, 'in-review', 'system', client.id, `Quote ${view.quote.number} declined: ${reason}`)
        : null;
      if (!moved?.ok) throw new Refused('The brief has moved on meanwhile; reload the quote.');
      const engineer = await quoteAuthor(tx, view);
      return engineer ? enqueueMail(tx, [declinedMail(view, engineer, reason, appUrl(`/desk/briefs/${view.brief.id}`))], now) : [];
    });
  } catch (err) {
    if (err instanceof Refused) return wrong(err.message);
    throw err;
  }
  await deliverQueuedMail(queued);
  return reload(view.quote.id);
}

export type QuoteJson = ReturnType<typeof quoteJson>;
