import { and, desc, eq, like, or, sql, type SQL } from 'drizzle-orm';
import { db } from './db';
import { brief, BRIEF_STATUSES, clientProfile, user, type BriefStatus } from './db/schema';
import { isStaff, type SignedInUser } from './guard';

export interface BriefListQuery {
  status?: BriefStatus | undefined;
  q?: string | undefined;
  page?: number;
  pageSize?: number;
}

export function isBriefStatus(value: unknown): value is BriefStatus {
  return typeof value === 'string' && (BRIEF_STATUSES as readonly string[]).includes(value);
}

/** Clients see their own briefs only; staff see every brief. Newest activity first. */
export async function listBriefs(viewer: SignedInUser, query: BriefListQuery = {}) {
  const page = Math.max(1, query.page ?? 1);
  const pageSize = Math.min(100, Math.max(1, query.pageSize ?? 25));
  const where: SQL[] = [];
  if (!isStaff(viewer)) where.push(eq(brief.ownerId, viewer.id));
  if (query.status) where.push(eq(brief.status, query.status));
  if (query.q) {
    const pattern = `%${query.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    const match = or(
      sql`${brief.title} LIKE ${pattern} ESCAPE '\\'`,
      sql`${clientProfile.company} LIKE ${pattern} ESCAPE '\\'`,
      like(user.name, pattern),
    );
    if (match) where.push(match);
  }
  const condition = where.length ? and(...where) : undefined;
  const [rows, totals] = await Promise.all([
    db
      .select({
        id: brief.id,
        title: brief.title,
        status: brief.status,
        recommendedTopology: brief.recommendedTopology,
        summary: brief.summary,
        submittedAt: brief.submittedAt,
        updatedAt: brief.updatedAt,
        clientName: user.name,
        company: clientProfile.company,
      })
      .from(brief)
      .innerJoin(user, eq(user.id, brief.ownerId))
      .leftJoin(clientProfile, eq(clientProfile.userId, brief.ownerId))
      .where(condition)
      .orderBy(desc(brief.updatedAt), desc(brief.id))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db
      .select({ n: sql<number>`count(*)` })
      .from(brief)
      .innerJoin(user, eq(user.id, brief.ownerId))
      .leftJoin(clientProfile, eq(clientProfile.userId, brief.ownerId))
      .where(condition),
  ]);
  return { rows, total: Number(totals[0]?.n ?? 0), page, pageSize };
}
