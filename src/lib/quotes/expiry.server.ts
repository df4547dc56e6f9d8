/**
 * Quotes past their validity lapse: a sent quote becomes expired, and a brief
 * waiting on it with it; an accepted quote whose deposit never came expires
 * too, and its brief goes back to review so the engineer can send a fresh
 * quote. Run lazily before each signed-in request (the middleware) rather than
 * on a timer: every instance may run it at any time, since each move is
 * conditional on the state read, so two instances never expire one quote twice.
 */
import { and, eq, gte, inArray, lt, ne } from 'drizzle-orm';
import { formatDate } from '../platform/format';
import { moveBrief } from '~/lib/briefs/index.server';
import { db } from '../platform/db';
import type { Transaction } from '../platform/db/connect';
import { brief, payment, quote, type QuoteRow } from '../platform/db/schema';
import { DAY_MS } from '../platform/time';
import { moveQuote } from './core.server';

/**
 * How long a hosted checkout stays payable at the provider. An accepted quote
 * with a checkout younger than this waits, so a client paying as the validity
 * runs out is not refunded; after it the checkout cannot be paid any more.
 */
export const CHECKOUT_LIFETIME_MS = DAY_MS;

export async function expireLapsedQuotes(now = new Date()): Promise<number> {
  const lapsed = await db
    .select()
    .from(quote)
    .where(and(inArray(quote.state, ['sent', 'accepted']), lt(quote.validUntil, now)))
    .limit(50);
  let expired = 0;
  for (const row of lapsed) {
    if (row.state === 'accepted' && (await hasLiveCheckout(row.id, now))) continue;
    await db.transaction(async (tx) => {
      const note = `Quote ${row.number} lapsed on ${formatDate(row.validUntil)}`;
      if (!(await moveQuote(tx, row, 'expired', null, {}, note))) return;
      expired++;
      if (row.state === 'accepted') await reopenBrief(tx, row, note);
      else await expireWaitingBrief(tx, row, now, note);
    });
  }
  return expired;
}

/** A deposit checkout of this quote that the client may still be paying. */
async function hasLiveCheckout(quoteId: string, now: Date): Promise<boolean> {
  const [live] = await db
    .select({ id: payment.id })
    .from(payment)
    .where(
      and(
        eq(payment.quoteId, quoteId),
        eq(payment.kind, 'deposit'),
        eq(payment.state, 'pending'),
        gte(payment.createdAt, new Date(now.getTime() - CHECKOUT_LIFETIME_MS)),
      ),
    )
    .limit(1);
  return live !== undefined;
}

/** The accepted brief goes back to review: the acceptance lapsed unpaid and a fresh quote is due. */
async function reopenBrief(tx: Transaction, row: QuoteRow, note: string) {
  const [briefRow] = await tx.select().from(brief).where(eq(brief.id, row.briefId)).limit(1);
  if (briefRow?.state === 'accepted') await moveBrief(tx, briefRow, 'in-review', 'system', null, `${note} before its deposit was paid`);
}

/** A brief waiting on the lapsed quote expires with it, unless a newer quote still stands. */
async function expireWaitingBrief(tx: Transaction, row: QuoteRow, now: Date, note: string) {
  const [briefRow] = await tx.select().from(brief).where(eq(brief.id, row.briefId)).limit(1);
  if (briefRow?.state !== 'quoted') return;
  const [standing] = await tx
    .select({ id: quote.id })
    .from(quote)
    .where(and(eq(quote.briefId, row.briefId), ne(quote.id, row.id), eq(quote.state, 'sent'), gte(quote.validUntil, now)))
    .limit(1);
  if (!standing) await moveBrief(tx, briefRow, 'expired', 'system', null, note);
}
