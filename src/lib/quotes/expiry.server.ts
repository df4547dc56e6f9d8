/**
 * Sent quotes past their validity become expired, and a brief waiting on such a
 * quote with them. Run lazily before each signed-in request (the middleware) rather than on a
 * timer: every instance may run it at any time, since each move is conditional
 * on the state read, so two instances never expire one quote twice.
 */
import { and, eq, gte, lt, ne } from 'drizzle-orm';
import { formatDate } from '../platform/format';
import { moveBrief } from '~/lib/briefs/index.server';
import { db } from '../platform/db';
import { brief, quote } from '../platform/db/schema';
import { moveQuote } from './core.server';

export async function expireLapsedQuotes(now = new Date()): Promise<number> {
  const lapsed = await db
    .select()
    .from(quote)
    .where(and(eq(quote.state, 'sent'), lt(quote.validUntil, now)))
    .limit(50);
  let expired = 0;
  for (const row of lapsed) {
    await db.transaction(async (tx) => {
      if (!(await moveQuote(tx, row, 'expired', null))) return;
      expired++;
      const [briefRow] = await tx.select().from(brief).where(eq(brief.id, row.briefId)).limit(1);
      if (briefRow?.state !== 'quoted') return;
      // A newer quote on the same brief that still stands keeps the brief open.
      const [standing] = await tx
        .select({ id: quote.id })
        .from(quote)
        .where(and(eq(quote.briefId, row.briefId), ne(quote.id, row.id), eq(quote.state, 'sent'), gte(quote.validUntil, now)))
        .limit(1);
      if (!standing)
        await moveBrief(tx, briefRow, 'expired', 'system', null, `Quote ${row.number} lapsed on ${formatDate(row.validUntil)}`);
    });
  }
  return expired;
}
