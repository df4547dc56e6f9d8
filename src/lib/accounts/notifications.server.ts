/** Which notice e-mails a person has turned off; the outbox leaves those out when it queues mail. */
import { eq } from 'drizzle-orm';
import { db } from '../platform/db';
import { mailOptOut } from '../platform/db/schema';
import type { SignedInUser } from '../platform/http/guard';
import { succeed, type Outcome } from '../platform/outcome';
import { notificationKindsFor } from './notifications';

export async function turnedOffKinds(userId: string): Promise<Set<string>> {
  const rows = await db.select({ kind: mailOptOut.kind }).from(mailOptOut).where(eq(mailOptOut.userId, userId));
  return new Set(rows.map((r) => r.kind));
}

/** Stores the person's choice: every kind of their role not ticked is turned off. */
export async function setNotifications(person: SignedInUser, ticked: Record<string, 'on' | undefined>): Promise<Outcome<null>> {
  const off = notificationKindsFor(person.role)
    .filter((k) => ticked[k.kind] !== 'on')
    .map((k) => k.kind);
  await db.transaction(async (tx) => {
    await tx.delete(mailOptOut).where(eq(mailOptOut.userId, person.id));
    if (off.length) await tx.insert(mailOptOut).values(off.map((kind) => ({ userId: person.id, kind })));
  });
  return succeed(null);
}
