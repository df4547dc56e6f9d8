/**
 * Quotes across briefs, one page at a time, filtered on the server: a client's own quotes (sent
 * onwards) or, for staff, every quote. The client's quotes page, the consultancy's and
 * `GET /api/v1/quotes` all read this.
 */
import { and, desc, eq, gte, lt, ne, or, sql, type SQL } from 'drizzle-orm';
import { db } from '../platform/db';
import { brief, clientProfile, payment, quote, user } from '../platform/db/schema';
import { isStaff, type SignedInUser } from '../platform/http/guard';
import { balanceDue } from './balance-due';
import type { QuoteListQuery } from './list-query';
import { stateAt } from './view.server';

const likePattern = (text: string) => `%${text.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;

/** The state filter as stored: a sent quote past its validity is listed as expired, as it reads everywhere else. */
function stateCondition(state: NonNullable<QuoteListQuery['state']>, now: Date): SQL | undefined {
  if (state === 'sent') return and(eq(quote.state, 'sent'), gte(quote.validUntil, now));
  if (state === 'expired') return or(eq(quote.state, 'expired'), and(eq(quote.state, 'sent'), lt(quote.validUntil, now)));
  return eq(quote.state, state);
}

export async function listQuotes(viewer: SignedInUser, query: QuoteListQuery, now = new Date()) {
  const { page, pageSize } = query;
  const where: (SQL | undefined)[] = [];
  if (isStaff(viewer)) {
    if (query.client) where.push(eq(brief.ownerId, query.client));
  } else {
    // A client never sees a draft: it is not an offer until it is sent.
    where.push(eq(brief.ownerId, viewer.id), ne(quote.state, 'draft'));
  }
  if (query.state) where.push(stateCondition(query.state, now));
  if (query.q) {
    const pattern = likePattern(query.q);
    where.push(
      or(...[quote.number, brief.title, user.name, clientProfile.company].map((column) => sql`${column} LIKE ${pattern} ESCAPE '\\'`)),
    );
  }
  const condition = and(...where);
  const paidOfKind = (kind: 'deposit' | 'balance') =>
    sql<number>`coalesce((select sum(${payment.amountMinor}) from ${payment} where ${payment.quoteId} = ${quote.id} and ${payment.kind} = ${kind} and ${payment.state} = 'paid'), 0)`;
  const depositPaid = paidOfKind('deposit');
  const balancePaid = paidOfKind('balance');
  const [rows, totals] = await Promise.all([
    db
      .select({
        quote,
        briefTitle: brief.title,
        ownerId: brief.ownerId,
        clientName: user.name,
        company: clientProfile.company,
        depositPaid,
        balancePaid,
      })
      .from(quote)
      .innerJoin(brief, eq(brief.id, quote.briefId))
      .innerJoin(user, eq(user.id, brief.ownerId))
      .leftJoin(clientProfile, eq(clientProfile.userId, brief.ownerId))
      .where(condition)
      .orderBy(desc(quote.createdAt), desc(quote.id))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db
      .select({ n: sql<number>`count(*)` })
      .from(quote)
      .innerJoin(brief, eq(brief.id, quote.briefId))
      .innerJoin(user, eq(user.id, brief.ownerId))
      .leftJoin(clientProfile, eq(clientProfile.userId, brief.ownerId))
      .where(condition),
  ]);
  return {
    items: rows.map((row) => {
      const q = row.quote;
      const depositPaidMinor = Number(row.depositPaid);
      const balancePaidMinor = Number(row.balancePaid);
      const state = stateAt(q, now);
      return {
        id: q.id,
        number: q.number,
        state,
        brief: { id: q.briefId, title: row.briefTitle },
        client: { id: row.ownerId, name: row.clientName, company: row.company },
        currency: q.currency,
        totalMinor: q.totalMinor,
        depositMinor: q.depositMinor,
        depositPaid: depositPaidMinor > 0,
        balanceMinor: balanceDue({ state, totalMinor: q.totalMinor, depositPaidMinor, balancePaidMinor }),
        paidInFull: balancePaidMinor > 0,
        validUntil: q.validUntil.toISOString(),
        sentAt: q.sentAt?.toISOString() ?? null,
        createdAt: q.createdAt.toISOString(),
      };
    }),
    total: Number(totals[0]?.n ?? 0),
    page,
    pageSize,
  };
}

export type QuoteList = Awaited<ReturnType<typeof listQuotes>>;
export type QuoteListItem = QuoteList['items'][number];

/** The clients who have a quote, for the consultancy's client filter. */
export async function listQuoteClients() {
  return db
    .selectDistinct({ id: user.id, name: user.name, company: clientProfile.company })
    .from(quote)
    .innerJoin(brief, eq(brief.id, quote.briefId))
    .innerJoin(user, eq(user.id, brief.ownerId))
    .leftJoin(clientProfile, eq(clientProfile.userId, brief.ownerId))
    .orderBy(clientProfile.company, user.name);
}
