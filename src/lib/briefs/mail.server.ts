import { eq, inArray } from 'drizzle-orm';
import { db } from '../platform/db';
import { clientProfile, user } from '../platform/db/schema';
import type { BriefRow } from './briefs.server';
import { mailer } from '../platform/mail/mailer';
import { appUrl } from '../platform/links';

/** Tells every engineer that a brief arrived; a failed mail is logged and does not undo the submission. */
export async function notifySubmitted(row: BriefRow): Promise<void> {
  const [staff, owner] = await Promise.all([
    db
      .select({ email: user.email })
      .from(user)
      .where(inArray(user.role, ['engineer'])),
    db
      .select({ name: user.name, company: clientProfile.company })
      .from(user)
      .leftJoin(clientProfile, eq(clientProfile.userId, user.id))
      .where(eq(user.id, row.ownerId))
      .limit(1),
  ]);
  const who = owner[0] ? `${owner[0].name}${owner[0].company ? ` (${owner[0].company})` : ''}` : 'A client';
  const summary = row.summary as { topology?: string } | null;
  await Promise.all(
    staff.map(({ email }) =>
      mailer.send({
        kind: 'brief-submitted',
        to: email,
        subject: `New brief: ${row.title}`,
        text: [
          `${who} submitted a supply brief: ${row.title}.`,
          summary?.topology
            ? `The engine's first pick is ${summary.topology}; review it before anything is promised.`
            : 'No option is feasible as briefed; it needs an engineer’s look.',
          '',
          `Open it: ${appUrl(`/desk/briefs/${row.id}`)}`,
        ].join('\n'),
        relatedId: row.id,
      }),
    ),
  );
}
