/**
 * The thread between a brief's client and the consultancy. Unlike the internal
 * notes both sides read it; each message is e-mailed to the other side, with a
 * link to the brief, through the outbox in the transaction that stores it.
 */
import { asc, eq, inArray } from 'drizzle-orm';
import { db } from '../platform/db';
import type { DbOrTx } from '../platform/db/connect';
import { briefMessage, designRevision, quote, user } from '../platform/db/schema';
import { isStaff, type SignedInUser } from '../platform/http/guard';
import { appUrl } from '../platform/links';
import { deliverQueuedMail } from '../platform/mail/mailer';
import { enqueueMail } from '../platform/mail/outbox';
import { refuse, succeed, type Outcome } from '../platform/outcome';
import type { BriefRow } from './briefs.server';
import { messageMails } from './mail.server';
import type { MessageRequest } from './requests';

export interface BriefMessage {
  id: string;
  body: string;
  createdAt: Date;
  author: { name: string; side: 'client' | 'consultancy' };
}

export async function listMessages(briefId: string): Promise<BriefMessage[]> {
  const rows = await db
    .select({ id: briefMessage.id, body: briefMessage.body, createdAt: briefMessage.createdAt, name: user.name, role: user.role })
    .from(briefMessage)
    .innerJoin(user, eq(user.id, briefMessage.authorId))
    .where(eq(briefMessage.briefId, briefId))
    .orderBy(asc(briefMessage.createdAt), asc(briefMessage.id));
  return rows.map(({ id, body, createdAt, name, role }) => ({
    id,
    body,
    createdAt,
    author: { name, side: role === 'client' ? 'client' : 'consultancy' },
  }));
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
  const { stored, queued } = await db.transaction(async (tx) => {
    const [inserted] = await tx.insert(briefMessage).values({ briefId: row.id, authorId: author.id, body }).returning();
    if (!inserted) throw new Error('Insert returned no message');
    const readers = fromClient
      ? await engineersOn(tx, row.id)
      : await tx.select({ name: user.name, email: user.email }).from(user).where(eq(user.id, row.ownerId));
    const link = appUrl(fromClient ? `/desk/briefs/${row.id}#messages` : `/briefs/${row.id}#messages`);
    const ids = await enqueueMail(tx, messageMails(row, author.name, body, readers, link));
    return { stored: inserted, queued: ids };
  });
  await deliverQueuedMail(queued);
  return succeed({
    id: stored.id,
    body: stored.body,
    createdAt: stored.createdAt,
    author: { name: author.name, side: fromClient ? 'client' : 'consultancy' },
  });
}

export function messageJson(message: BriefMessage) {
  return { ...message, createdAt: message.createdAt.toISOString() };
}
export type MessageJson = ReturnType<typeof messageJson>;
