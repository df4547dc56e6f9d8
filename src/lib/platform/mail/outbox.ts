/**
 * The mail outbox: a mail is written in the same transaction as the change it
 * tells of, then delivered by whichever app instance claims it first, and
 * retried with growing waits when the mail server does not take it. A crash
 * between the change and the delivery loses neither; the worth of a mail that
 * never gets through is shown to the engineer (`failed` after the last try).
 */
import { and, asc, desc, eq, inArray, isNull, lte, or } from 'drizzle-orm';
import type { Database, DbOrTx } from '../db/connect';
import { mailOptOut, mailOutbox, user, type OutboxRow } from '../db/schema';
import type { Mailer, OutgoingMail } from './transport';

/** Tries before a mail is given up on: about a day with the waits below. */
export const MAX_ATTEMPTS = 10;
const FIRST_WAIT_MS = 30_000;
const LONGEST_WAIT_MS = 4 * 3_600_000;
/** How long one worker holds a claimed mail; one that died lets it go after this. Longer than a send may take (transport.ts). */
const CLAIM_MS = 60_000;

/** The wait before try `attempts + 1`: 30 s, 1 min, 2 min … at most 4 h. */
export const retryWaitMs = (attempts: number) => Math.min(FIRST_WAIT_MS * 2 ** Math.max(0, attempts - 1), LONGEST_WAIT_MS);

/** The mails whose recipient has turned their kind off (on the account page) are left out. */
async function wantedMails(tx: DbOrTx, mails: readonly OutgoingMail[]): Promise<OutgoingMail[]> {
  const refused = await tx
    .select({ email: user.email, kind: mailOptOut.kind })
    .from(mailOptOut)
    .innerJoin(user, eq(user.id, mailOptOut.userId))
    .where(
      and(
        inArray(
          user.email,
          mails.map((m) => m.to),
        ),
        inArray(
          mailOptOut.kind,
          mails.map((m) => m.kind),
        ),
      ),
    );
  const off = new Set(refused.map((r) => `${r.kind} ${r.email}`));
  return mails.filter((m) => !off.has(`${m.kind} ${m.to}`));
}

/** Queues mail inside the caller's transaction, except kinds the recipient turned off; returns the queued ids. */
export async function enqueueMail(tx: DbOrTx, all: readonly OutgoingMail[], now = new Date()): Promise<string[]> {
  const mails = all.length ? await wantedMails(tx, all) : [];
  if (mails.length === 0) return [];
  const rows = await tx
    .insert(mailOutbox)
    .values(
      mails.map((mail) => ({
        kind: mail.kind,
        toAddress: mail.to,
        subject: mail.subject,
        bodyText: mail.text,
        bodyHtml: mail.html ?? null,
        attachments:
          mail.attachments?.map((a) => ({ filename: a.filename, contentType: a.contentType, base64: a.content.toString('base64') })) ??
          null,
        relatedId: mail.relatedId ?? null,
        nextAttemptAt: now,
        createdAt: now,
      })),
    )
    .returning({ id: mailOutbox.id });
  return rows.map((row) => row.id);
}

const due = (now: Date) =>
  and(
    eq(mailOutbox.state, 'queued'),
    lte(mailOutbox.nextAttemptAt, now),
    or(isNull(mailOutbox.claimedUntil), lte(mailOutbox.claimedUntil, now)),
  );

/**
 * Claims due mail (all of it, or the given ids) in one statement, so two
 * workers never both take the same row, then sends each and records the outcome.
 * Returns how many were delivered.
 */
export async function deliverDueMail(
  db: Database,
  mailer: Mailer,
  options: { ids?: readonly string[]; now?: Date; batch?: number } = {},
): Promise<number> {
  const now = options.now ?? new Date();
  const candidates = db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(options.ids ? and(due(now), inArray(mailOutbox.id, [...options.ids])) : due(now))
    .orderBy(asc(mailOutbox.nextAttemptAt))
    .limit(options.batch ?? 20);
  const claimed = await db
    .update(mailOutbox)
    .set({ claimedUntil: new Date(now.getTime() + CLAIM_MS) })
    .where(and(inArray(mailOutbox.id, candidates), due(now)))
    .returning();
  let delivered = 0;
  for (const row of claimed) if (await deliverOne(db, mailer, row)) delivered++;
  return delivered;
}

async function deliverOne(db: Database, mailer: Mailer, row: OutboxRow): Promise<boolean> {
  const result = await mailer.send({
    kind: row.kind,
    to: row.toAddress,
    subject: row.subject,
    text: row.bodyText,
    ...(row.bodyHtml ? { html: row.bodyHtml } : {}),
    ...(row.attachments
      ? {
          attachments: row.attachments.map((a) => ({
            filename: a.filename,
            contentType: a.contentType,
            content: Buffer.from(a.base64, 'base64'),
          })),
        }
      : {}),
    ...(row.relatedId ? { relatedId: row.relatedId } : {}),
  });
  const attempts = row.attempts + 1;
  const finished = new Date();
  if (result.ok) {
    await db
      .update(mailOutbox)
      .set({ state: 'sent', attempts, sentAt: finished, claimedUntil: null, lastError: null })
      .where(eq(mailOutbox.id, row.id));
    return true;
  }
  await db
    .update(mailOutbox)
    .set({
      state: attempts >= MAX_ATTEMPTS ? 'failed' : 'queued',
      attempts,
      lastError: result.error,
      nextAttemptAt: new Date(finished.getTime() + retryWaitMs(attempts)),
      claimedUntil: null,
    })
    .where(eq(mailOutbox.id, row.id));
  return false;
}

/** Where a thing's latest mail of one kind stands, for the pages that show it (the quote builder). */
export async function latestOutboxEntry(db: DbOrTx, relatedId: string, kind: string): Promise<OutboxRow | null> {
  const [row] = await db
    .select()
    .from(mailOutbox)
    .where(and(eq(mailOutbox.relatedId, relatedId), eq(mailOutbox.kind, kind)))
    .orderBy(desc(mailOutbox.createdAt))
    .limit(1);
  return row ?? null;
}

export interface OutboxWorker {
  /** Delivers now what is due (after a change that queued mail committed). */
  kick(ids?: readonly string[]): Promise<void>;
  stop(): void;
}

/**
 * Polls the outbox every `intervalMs` on this instance. Any number of
 * instances may run one: the claim decides who sends each mail.
 */
export function startOutboxWorker(db: Database, mailer: Mailer, log: (error: unknown) => void, intervalMs = 5_000): OutboxWorker {
  let running: Promise<unknown> = Promise.resolve();
  const run = (ids?: readonly string[]) => {
    running = running.then(() => deliverDueMail(db, mailer, ids ? { ids } : {})).catch(log);
    return running.then(() => undefined);
  };
  const timer = setInterval(() => void run(), intervalMs);
  timer.unref();
  return { kick: run, stop: () => clearInterval(timer) };
}
