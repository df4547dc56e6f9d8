import { APIError } from 'better-auth/api';
import { and, eq, or, sql } from 'drizzle-orm';
import type { resetPasswordSchema, signInSchema, signUpSchema } from './schemas';
import { limitPasswordReset, limitSignUp } from '../platform/rate-limit/account-limits';
import { countSignInAttempt } from '../platform/rate-limit/sign-in-limit';
import { auth } from '../platform/auth';
import { ACCOUNT_DEACTIVATED } from '../platform/auth/create-auth';
import { ROLE_LABELS, type Role } from '../platform/auth/roles';
import { refuse, succeed, type Outcome, type Refusal } from '../platform/outcome';
import { log } from '../platform/log';
import { z } from 'zod';
import { db } from '../platform/db';
import { clientProfile, user } from '../platform/db/schema';

const tooManyAttempts = (retryAfterSeconds: number): Refusal =>
  refuse('rate-limited', `Too many attempts. Wait ${retryAfterSeconds} seconds, then try again.`, { retryAfterSeconds });

type SignUp = z.infer<typeof signUpSchema>;

/** Creates a client account (better-auth) and its company profile, and signs it in. */
export async function registerClient(
  data: SignUp,
  headers: Headers,
  address: string,
): Promise<Outcome<{ headers: Headers; userId: string; name: string }>> {
  const verdict = await limitSignUp(address);
  if (!verdict.allowed) return tooManyAttempts(verdict.retryAfterSeconds);
  try {
    const result = await auth.api.signUpEmail({
      body: { name: data.name, email: data.email, password: data.password },
      headers,
      returnHeaders: true,
    });
    const userId = result.response.user.id;
    await db.insert(clientProfile).values({ userId, company: data.company }).onConflictDoNothing();
    return succeed({ headers: result.headers, userId, name: data.name });
  } catch (err) {
    if (err instanceof APIError && err.status === 'UNPROCESSABLE_ENTITY') {
      return refuse('wrong-state', 'An account with this e-mail already exists. Sign in instead, or reset the password.', {
        code: 'account_exists',
      });
    }
    if (err instanceof APIError) return refuse('invalid', err.message || 'The account could not be created.', { code: 'sign_up_failed' });
    throw err;
  }
}

/**
 * The role is written only if the product keeps an admin afterwards: the
 * count is taken inside the same UPDATE, so two admins demoting each other at
 * once cannot both succeed. The caller's own admin role is checked by the page's guard.
 */
export async function changeRole(admin: { id: string }, change: { userId: string; role: Role }): Promise<Outcome<Role>> {
  if (change.userId === admin.id) return refuse('wrong-state', 'You cannot change your own role; ask another admin.');
  const keepsAnAdmin = or(
    sql`coalesce(${user.role}, '') <> 'admin'`,
    sql`${change.role} = 'admin'`,
    sql`(SELECT count(*) FROM "user" AS admins WHERE admins.role = 'admin') > 1`,
  );
  const changed = await db
    .update(user)
    .set({ role: change.role, updatedAt: new Date() })
    .where(and(eq(user.id, change.userId), keepsAnAdmin))
    .returning({ id: user.id });
  if (changed.length > 0) return succeed(change.role);
  const [person] = await db.select({ id: user.id }).from(user).where(eq(user.id, change.userId));
  if (!person) return refuse('not-found', 'That person no longer has an account.');
  return refuse('wrong-state', 'This is the last admin. Make someone else an admin first, then change this role.');
}

export const roleChangedMessage = (role: Role) => `Role changed to ${ROLE_LABELS[role]}.`;

/**
 * A password sign-in from the form page. Every attempt is counted before it
 * runs, against the address and the account; a correct one is given back.
 */
export async function signInWithPassword(
  credentials: z.infer<typeof signInSchema>,
  headers: Headers,
  address: string,
): Promise<Outcome<{ headers: Headers; role: string | undefined }>> {
  const attempt = await countSignInAttempt(address, credentials.email);
  if (!attempt.verdict.allowed) return tooManyAttempts(attempt.verdict.retryAfterSeconds);
  try {
    const result = await auth.api.signInEmail({ body: credentials, headers, returnHeaders: true });
    await attempt.forgive();
    return succeed({ headers: result.headers, role: (result.response.user as { role?: string }).role });
  } catch (err) {
    // better-auth checks the password before it refuses a deactivated account, so only its holder learns of it.
    if (err instanceof APIError && (err.body as { code?: string } | undefined)?.code === 'BANNED_USER')
      return refuse('forbidden', ACCOUNT_DEACTIVATED, { code: 'account_deactivated' });
    return refuse('unauthenticated', 'That e-mail and password do not match an account.');
  }
}

/**
 * Asks for a reset link. The same answer, after the same work, whether or not
 * the account exists: the look-up and the e-mail happen after the answer, so
 * its timing reveals nothing either.
 */
export async function requestPasswordReset(email: string, headers: Headers, address: string): Promise<Outcome<void>> {
  const verdict = await limitPasswordReset(address, email);
  if (!verdict.allowed) return tooManyAttempts(verdict.retryAfterSeconds);
  auth.api.requestPasswordReset({ body: { email }, headers }).catch((error: unknown) => {
    log.warn({ err: error }, 'password reset e-mail not sent');
  });
  return succeed(undefined);
}

export const RESET_LINK_DEAD = 'This reset link has expired or was already used. Ask for a new one.';

export async function resetPassword(reset: z.infer<typeof resetPasswordSchema>, headers: Headers): Promise<Outcome<void>> {
  try {
    await auth.api.resetPassword({ body: { token: reset.token, newPassword: reset.password }, headers });
    return succeed(undefined);
  } catch {
    return refuse('invalid', RESET_LINK_DEAD, { code: 'reset_link_dead' });
  }
}
