/**
 * What an admin does with accounts on the people page: find someone, invite a
 * colleague or client, deactivate and reactivate an account, send a reset link.
 * Every e-mail is queued in the transaction of the change it tells of.
 */
import { count, desc, eq, or, sql } from 'drizzle-orm';
import { z } from 'zod';
import { changeRole } from './accounts.server';
import { INVITE_LINK_SECONDS, inviteMail } from './mail.server';
export { INVITE_LINK_DAYS } from './mail.server';
import { signUpSchema } from './schemas';
import { passwordLink } from '../platform/auth';
import { issuePasswordToken, RESET_LINK_SECONDS } from '../platform/auth/password-token';
import { passwordResetMail } from '../platform/auth/reset-mail';
import { ROLES, type Role } from '../platform/auth/roles';
import { db } from '../platform/db';
import { account, clientProfile, session, user } from '../platform/db/schema';
import { deliverQueuedMail } from '../platform/mail/mailer';
import { enqueueMail } from '../platform/mail/outbox';
import { refuse, succeed, type Outcome } from '../platform/outcome';

export const PEOPLE_PAGE_SIZE = 20;

const personId = z.string({ error: 'Choose a person.' }).min(1, { error: 'Choose a person.' });
const role = z.enum(ROLES, { error: 'Choose one of the roles.' });

/** The people page's forms: one `intent` per thing an admin does to an account. */
export const peopleActionSchema = z.discriminatedUnion(
  'intent',
  [
    z.object({ intent: z.literal('role'), userId: personId, role }),
    z.object({
      intent: z.literal('invite'),
      name: signUpSchema.shape.name,
      email: signUpSchema.shape.email.max(254, { error: 'Use at most 254 characters.' }),
      company: z.string().trim().max(160, { error: 'Use at most 160 characters.' }).optional(),
      role,
    }),
    z.object({ intent: z.literal('deactivate'), userId: personId }),
    z.object({ intent: z.literal('reactivate'), userId: personId }),
    z.object({ intent: z.literal('reset'), userId: personId }),
  ],
  { error: 'Choose what to do.' },
);
export type PeopleAction = z.infer<typeof peopleActionSchema>;
/** What the page says after each action (`?done=`). */
export type PeopleDone = 'invited' | 'deactivated' | 'reactivated' | 'reset' | Role;

export const peopleSearchSchema = z.object({
  q: z.string().trim().max(120).catch(''),
  page: z.coerce.number().int().min(1).catch(1),
});

/** People whose name or e-mail contains the words typed, newest account first, a page at a time. */
export async function searchPeople(query: z.infer<typeof peopleSearchSchema>) {
  const pattern = `%${query.q.toLowerCase().replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
  const match = query.q
    ? or(sql`lower(${user.name}) LIKE ${pattern} ESCAPE '\\'`, sql`lower(${user.email}) LIKE ${pattern} ESCAPE '\\'`)
    : undefined;
  const [totals] = await db.select({ n: count() }).from(user).where(match);
  const total = totals?.n ?? 0;
  const pages = Math.max(1, Math.ceil(total / PEOPLE_PAGE_SIZE));
  const page = Math.min(query.page, pages);
  const people = await db
    .select({
      id: user.id,
      name: user.name,
      email: user.email,
      role: user.role,
      createdAt: user.createdAt,
      deactivated: user.banned,
      // An invited person has no password until the invitation's link is used.
      invited:
        sql<boolean>`not exists (select 1 from ${account} where ${account.userId} = ${user.id} and ${account.providerId} = 'credential')`.mapWith(
          Boolean,
        ),
      company: clientProfile.company,
    })
    .from(user)
    .leftJoin(clientProfile, eq(clientProfile.userId, user.id))
    .where(match)
    .orderBy(desc(user.createdAt), desc(user.id))
    .limit(PEOPLE_PAGE_SIZE)
    .offset((page - 1) * PEOPLE_PAGE_SIZE);
  return { people, total, page, pages };
}

export async function actOnPerson(admin: { id: string; name: string }, action: PeopleAction): Promise<Outcome<PeopleDone>> {
  switch (action.intent) {
    case 'role':
      return changeRole(admin, action);
    case 'invite':
      return invitePerson(admin, action);
    case 'deactivate':
    case 'reactivate':
      return setActive(admin, action.userId, action.intent === 'reactivate');
    case 'reset':
      return sendResetLink(action.userId);
  }
}

/** A new account with the role chosen and no password; the e-mail's link chooses one (once, within three days). */
async function invitePerson(
  admin: { name: string },
  invite: { name: string; email: string; company?: string | undefined; role: Role },
): Promise<Outcome<PeopleDone>> {
  const email = invite.email.toLowerCase();
  const queued = await db.transaction(async (tx) => {
    const [taken] = await tx.select({ id: user.id }).from(user).where(eq(user.email, email));
    if (taken) return null;
    const userId = crypto.randomUUID();
    await tx.insert(user).values({ id: userId, name: invite.name, email, role: invite.role, emailVerified: false });
    if (invite.company) await tx.insert(clientProfile).values({ userId, company: invite.company });
    const token = await issuePasswordToken(tx, userId, INVITE_LINK_SECONDS);
    return enqueueMail(tx, [inviteMail({ email, name: invite.name }, invite.role, admin.name, passwordLink(token))]);
  });
  if (!queued)
    return refuse('wrong-state', 'An account with this e-mail already exists; search for it instead.', { code: 'account_exists' });
  await deliverQueuedMail(queued);
  return succeed('invited');
}

/**
 * Deactivating ends every session of the account at once and refuses its
 * next sign-in (better-auth's admin plugin reads `banned`); reactivating
 * lets it sign in again with the same password.
 */
async function setActive(admin: { id: string }, userId: string, active: boolean): Promise<Outcome<PeopleDone>> {
  if (!active && userId === admin.id) return refuse('wrong-state', 'You cannot deactivate your own account; ask another admin.');
  const changed = await db.transaction(async (tx) => {
    const rows = await tx
      .update(user)
      .set({ banned: !active, banReason: active ? null : 'deactivated by an admin', updatedAt: new Date() })
      .where(eq(user.id, userId))
      .returning({ id: user.id });
    if (rows.length > 0 && !active) await tx.delete(session).where(eq(session.userId, userId));
    return rows.length > 0;
  });
  if (!changed) return refuse('not-found', 'That person no longer has an account.');
  return succeed(active ? 'reactivated' : 'deactivated');
}

/** The same one-hour link the person would get by asking for it themselves. */
async function sendResetLink(userId: string): Promise<Outcome<PeopleDone>> {
  const queued = await db.transaction(async (tx) => {
    const [person] = await tx
      .select({ id: user.id, name: user.name, email: user.email, deactivated: user.banned })
      .from(user)
      .where(eq(user.id, userId));
    if (!person || person.deactivated) return person ? 'deactivated' : null;
    const token = await issuePasswordToken(tx, person.id, RESET_LINK_SECONDS);
    return enqueueMail(tx, [passwordResetMail(person, passwordLink(token))]);
  });
  if (queued === null) return refuse('not-found', 'That person no longer has an account.');
  if (queued === 'deactivated') return refuse('wrong-state', 'This account is deactivated; reactivate it before sending a reset link.');
  await deliverQueuedMail(queued);
  return succeed('reset');
}
