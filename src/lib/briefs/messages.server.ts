/**
 * The thread between a brief's client and the consultancy. Unlike the internal
 * notes both sides read it; each message is e-mailed to the other side, with a
 * link to the brief, through the outbox in the transaction that stores it.
 */
import { and, asc, desc, eq, gt, inArray, isNull, ne, or, sql } from 'drizzle-orm';
import { db } from '../platform/db';
import type { DbOrTx } from '../platform/db/connect';
import { brief, briefFile, briefMessage, briefRead, designRevision, quote, user } from '../platform/db/schema';
import { isStaff, type SignedInUser } from '../platform/http/guard';
import { appUrl } from '../platform/links';
import { deliverQueuedMail } from '../platform/mail/mailer';
import { enqueueMail } from '../platform/mail/outbox';
import { refuse, succeed, type Outcome, type Refusal } from '../platform/outcome';
import type { BriefRow } from './briefs.server';
import { messageMails } from './mail.server';
import type { MessageRequest } from './requests';

/** A file sent with a message; its bytes come from `GET /api/v1/files/:id`, under that route's access rules. */
export interface MessageAttachment {
  id: string;
  name: string;
  sizeBytes: number;
}

export interface BriefMessage {
  id: string;
  body: string;
  createdAt: Date;
  author: { name: string; side: 'client' | 'consultancy' };
  attachments: MessageAttachment[];
}

const attachmentColumns = { id: briefFile.id, name: briefFile.originalName, sizeBytes: briefFile.sizeBytes };

export async function listMessages(briefId: string): Promise<BriefMessage[]> {
  const [rows, files] = await Promise.all([
    db
      .select({ id: briefMessage.id, body: briefMessage.body, createdAt: briefMessage.createdAt, name: user.name, role: user.role })
      .from(briefMessage)
      .innerJoin(user, eq(user.id, briefMessage.authorId))
      .where(eq(briefMessage.briefId, briefId))
      .orderBy(asc(briefMessage.createdAt), asc(briefMessage.id)),
    db
      .select({ ...attachmentColumns, messageId: briefFile.messageId })
      .from(briefFile)
      .where(eq(briefFile.briefId, briefId))
      .orderBy(asc(briefFile.createdAt), asc(briefFile.id)),
  ]);
  return rows.map(({ id, body, createdAt, name, role }) => ({
    id,
    body,
    createdAt,
    author: { name, side: role === 'client' ? 'client' : 'consultancy' },
    attachments: files
      .filter((f) => f.messageId === id)
      .map(({ id: fileId, name: fileName, sizeBytes }) => ({ id: fileId, name: fileName, sizeBytes })),
  }));
}

/** Raised inside the transaction so that the message is rolled back with its refusal. */
class AttachmentRefused extends Error {
  constructor(readonly refusal: Refusal) {
    super('A file cannot be attached to this message.');
  }
}

/** Ties the writer's own, not yet sent files of this brief to the message; any other id refuses the whole message. */
async function attachFiles(tx: DbOrTx, briefId: string, authorId: string, messageId: string, ids: readonly string[]) {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return [];
  const attached = await tx
    .update(briefFile)
    .set({ messageId })
    .where(
      and(inArray(briefFile.id, unique), eq(briefFile.briefId, briefId), eq(briefFile.uploadedBy, authorId), isNull(briefFile.messageId)),
    )
    .returning(attachmentColumns);
  if (attached.length !== unique.length)
    throw new AttachmentRefused(
      refuse('invalid', 'A file to attach is not one you uploaded to this brief, or it went with another message; upload it again.', {
        code: 'invalid_attachment',
        issues: [{ path: 'attachmentIds', message: 'Upload the file to this brief first, then send it with one message.' }],
      }),
    );
  return attached;
}

/** The engineers who worked on the brief (its revisions and quotes); all engineers when nobody has yet. */
async function engineersOn(tx: DbOrTx, briefId: string): Promise<{ name: string; email: string }[]> {
  const [revisions, quotes] = await Promise.all([
    tx.selectDistinct({ id: designRevision.authorId }).from(designRevision).where(eq(designRevision.briefId, briefId)),
    tx.selectDistinct({ id: quote.createdBy }).from(quote).where(eq(quote.briefId, briefId)),
  ]);
  const ids = [...new Set([...revisions, ...quotes].map((r) => r.id))];
  const people = ids.length
    ? await tx.select({ name: user.name, email: user.email, role: user.role }).from(user).where(inArray(user.id, ids))
    : [];
  const engineers = people.filter((p) => p.role === 'engineer' || p.role === 'admin');
  return engineers.length ? engineers : tx.select({ name: user.name, email: user.email }).from(user).where(eq(user.role, 'engineer'));
}

/** Stores a message from either side and queues its e-mail to the other side in the same transaction. */
export async function postMessage(row: BriefRow, author: SignedInUser, request: MessageRequest): Promise<Outcome<BriefMessage>> {
  if (row.state === 'draft') return refuse('wrong-state', 'The consultancy sees a brief once it is submitted; submit it, then write here.');
  const fromClient = !isStaff(author);
  const body = request.body.trim();
  let sent;
  try {
    sent = await db.transaction(async (tx) => {
      const [inserted] = await tx.insert(briefMessage).values({ briefId: row.id, authorId: author.id, body }).returning();
      if (!inserted) throw new Error('Insert returned no message');
      const attachments = await attachFiles(tx, row.id, author.id, inserted.id, request.attachmentIds);
      const readers = fromClient
        ? await engineersOn(tx, row.id)
        : await tx.select({ name: user.name, email: user.email }).from(user).where(eq(user.id, row.ownerId));
      const link = appUrl(fromClient ? `/desk/briefs/${row.id}#messages` : `/briefs/${row.id}#messages`);
      const names = attachments.map((a) => a.name);
      const ids = await enqueueMail(tx, messageMails(row, author.name, body, readers, link, names));
      return { stored: inserted, attachments, queued: ids };
    });
  } catch (error) {
    if (error instanceof AttachmentRefused) return error.refusal;
    throw error;
  }
  await deliverQueuedMail(sent.queued);
  return succeed({
    id: sent.stored.id,
    body: sent.stored.body,
    createdAt: sent.stored.createdAt,
    author: { name: author.name, side: fromClient ? 'client' : 'consultancy' },
    attachments: sent.attachments,
  });
}

export function messageJson(message: BriefMessage) {
  return { ...message, createdAt: message.createdAt.toISOString() };
}
export type MessageJson = ReturnType<typeof messageJson>;

/** Records that the viewer has read the thread up to the newest message shown to them (a later message stays unread). */
export async function markThreadRead(viewerId: string, briefId: string, shown: readonly { createdAt: Date }[]) {
  const newest = shown.reduce<Date | null>((latest, m) => (latest && latest >= m.createdAt ? latest : m.createdAt), null);
  if (!newest) return;
  await db
    .insert(briefRead)
    .values({ userId: viewerId, briefId, readAt: newest })
    .onConflictDoUpdate({
      target: [briefRead.userId, briefRead.briefId],
      set: { readAt: sql`max(${briefRead.readAt}, excluded.read_at)` },
    });
}

export interface UnreadMessages {
  count: number;
  /** The brief with the newest unread message, where the header's link leads. */
  briefId: string | null;
}

/**
 * Messages from the other side the viewer has not read: for a client, the consultancy's on their
 * own briefs; for staff, clients' messages on every brief. Read from the database on each page.
 */
export async function unreadMessages(viewer: SignedInUser): Promise<UnreadMessages> {
  const fromOtherSide = isStaff(viewer) ? eq(user.role, 'client') : and(eq(brief.ownerId, viewer.id), ne(user.role, 'client'));
  const rows = await db
    .select({ briefId: briefMessage.briefId, count: sql<number>`count(*) over ()` })
    .from(briefMessage)
    .innerJoin(brief, eq(brief.id, briefMessage.briefId))
    .innerJoin(user, eq(user.id, briefMessage.authorId))
    .leftJoin(briefRead, and(eq(briefRead.briefId, briefMessage.briefId), eq(briefRead.userId, viewer.id)))
    .where(
      and(fromOtherSide, ne(briefMessage.authorId, viewer.id), or(isNull(briefRead.readAt), gt(briefMessage.createdAt, briefRead.readAt))),
    )
    .orderBy(desc(briefMessage.createdAt))
    .limit(1);
  const [newest] = rows;
  return { count: Number(newest?.count ?? 0), briefId: newest?.briefId ?? null };
}
