import { notYours, succeed, type Outcome } from '../platform/outcome';
import { and, desc, eq, like, or, sql, type SQL } from 'drizzle-orm';
import type { BriefSummary } from './summary';
import { db } from '../platform/db';
import { brief, BRIEF_STATES, briefFile, clientProfile, stateChange, user, type BriefState, type BriefRow } from '../platform/db/schema';
import { isStaff, type SignedInUser } from '../platform/http/guard';
import type { BriefSort } from './sorting';

export interface BriefListQuery {
  state?: BriefState | undefined;
  q?: string | undefined;
  ownerId?: string | undefined;
  page?: number;
  pageSize?: number;
  sort?: BriefSort;
}

export function isBriefState(value: unknown): value is BriefState {
  return typeof value === 'string' && (BRIEF_STATES as readonly string[]).includes(value);
}

function orderFor(sort: BriefSort) {
  const column = sort.endsWith('title') ? brief.title : sort.endsWith('submitted') ? brief.submittedAt : brief.updatedAt;
  // A leading '-' means newest/last first, the usual default for dates.
  return sort.startsWith('-') ? [desc(column), desc(brief.id)] : [column, brief.id];
}

/** Clients see their own briefs only; staff see every brief. Newest activity first by default. */
export async function listBriefs(viewer: SignedInUser, query: BriefListQuery = {}) {
  const page = Math.max(1, query.page ?? 1);
  const pageSize = Math.min(100, Math.max(1, query.pageSize ?? 25));
  const where: SQL[] = [];
  if (!isStaff(viewer)) where.push(eq(brief.ownerId, viewer.id));
  else if (query.ownerId) where.push(eq(brief.ownerId, query.ownerId));
  if (query.state) where.push(eq(brief.state, query.state));
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
        state: brief.state,
        ownerId: brief.ownerId,
        recommendedTopology: brief.recommendedTopology,
        summary: brief.summary,
        submittedAt: brief.submittedAt,
        updatedAt: brief.updatedAt,
        clientName: user.name,
        company: clientProfile.company,
        // The highest voltage on the rail, so the desk can flag hazardous ones before a brief is opened.
        highestV: sql<
          number | null
        >`max(coalesce(json_extract(${brief.spec}, '$.input.vMax'), 0), coalesce(json_extract(${brief.spec}, '$.output.v'), 0))`,
      })
      .from(brief)
      .innerJoin(user, eq(user.id, brief.ownerId))
      .leftJoin(clientProfile, eq(clientProfile.userId, brief.ownerId))
      .where(condition)
      .orderBy(...orderFor(query.sort ?? '-updated'))
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

export type BriefList = Awaited<ReturnType<typeof listBriefs>>;

/** The list answer of `GET /api/v1/briefs`, also handed to the desk table as its first page. */
export function briefListJson(list: BriefList) {
  return {
    items: list.rows.map((row) => ({
      id: row.id,
      title: row.title,
      state: row.state,
      client: { id: row.ownerId, name: row.clientName, company: row.company },
      recommendedTopology: row.recommendedTopology,
      summary: row.summary as BriefSummary | null,
      highestV: typeof row.highestV === 'number' && row.highestV > 0 ? row.highestV : null,
      submittedAt: row.submittedAt?.toISOString() ?? null,
      updatedAt: row.updatedAt.toISOString(),
    })),
    total: list.total,
    page: list.page,
    pageSize: list.pageSize,
  };
}

/** Everyone who has a brief, for the desk's client filter. */
export async function listBriefOwners() {
  return db
    .selectDistinct({ id: user.id, name: user.name, company: clientProfile.company })
    .from(brief)
    .innerJoin(user, eq(user.id, brief.ownerId))
    .leftJoin(clientProfile, eq(clientProfile.userId, brief.ownerId))
    .orderBy(clientProfile.company, user.name);
}

export type { BriefRow };

/**
 * The brief if this viewer may see it, else null — the caller answers 404 either
 * way, so a client never learns that another client's brief exists.
 */
export async function findBriefFor(viewer: SignedInUser, id: string): Promise<BriefRow | null> {
  const [row] = await db.select().from(brief).where(eq(brief.id, id)).limit(1);
  if (!row) return null;
  if (!isStaff(viewer) && row.ownerId !== viewer.id) return null;
  return row;
}

/** The same lookup as an outcome, for actions that continue with the brief. */
export async function briefOf(viewer: SignedInUser, id: string | undefined): Promise<Outcome<BriefRow>> {
  const row = await findBriefFor(viewer, id ?? '');
  return row ? succeed(row) : notYours();
}

export async function briefDetail(row: BriefRow) {
  const [files, history, owner] = await Promise.all([
    db
      .select({
        id: briefFile.id,
        kind: briefFile.kind,
        name: briefFile.originalName,
        mimeType: briefFile.mimeType,
        sizeBytes: briefFile.sizeBytes,
        loadSummary: briefFile.loadSummary,
        createdAt: briefFile.createdAt,
      })
      .from(briefFile)
      .where(eq(briefFile.briefId, row.id))
      .orderBy(briefFile.createdAt),
    db
      .select({ from: stateChange.fromState, to: stateChange.toState, at: stateChange.createdAt, by: user.name, note: stateChange.note })
      .from(stateChange)
      .leftJoin(user, eq(user.id, stateChange.actorId))
      .where(and(eq(stateChange.subjectType, 'brief'), eq(stateChange.subjectId, row.id)))
      .orderBy(stateChange.createdAt),
    db
      .select({ name: user.name, email: user.email, company: clientProfile.company })
      .from(user)
      .leftJoin(clientProfile, eq(clientProfile.userId, user.id))
      .where(eq(user.id, row.ownerId))
      .limit(1),
  ]);
  return { ...row, owner: owner[0] ?? null, files, history };
}
