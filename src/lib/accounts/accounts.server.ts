import { APIError } from 'better-auth/api';
import { eq } from 'drizzle-orm';
import type { resetPasswordSchema, signInSchema, signUpSchema } from './schemas';
import { recordFailedSignIn, signInAllowed } from '../platform/rate-limit/sign-in-limit';
import { auth } from '../platform/auth';
import { ROLE_LABELS, ROLES, type Role } from '../platform/auth/roles';
import { refuse, succeed, type Outcome } from '../platform/outcome';
import { z } from 'zod';
import { db } from '../platform/db';
import { clientProfile, user } from '../platform/db/schema';

type SignUp = z.infer<typeof signUpSchema>;

/** Creates a client account (better-auth) and its company profile, and signs it in. */
export async function registerClient(data: SignUp, headers: Headers): Promise<Outcome<{ headers: Headers; userId: string; name: string }>> {
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

export async function listPeople() {
  return db
    .select({ id: user.id, name: user.name, email: user.email, role: user.role, createdAt: user.createdAt, company: clientProfile.company })
    .from(user)
    .leftJoin(clientProfile, eq(clientProfile.userId, user.id))
    .orderBy(user.createdAt);
}

export const roleChangeSchema = z.object({
  userId: z.string({ error: 'Choose a person.' }).min(1, { error: 'Choose a person.' }),
  role: z.enum(ROLES, { error: 'Choose one of the roles.' }),
});

/** Role changes go through better-auth's admin plugin so its permission check applies too. */
export async function changeRole(
  admin: { id: string },
  change: z.infer<typeof roleChangeSchema>,
  headers: Headers,
): Promise<Outcome<Role>> {
  if (change.userId === admin.id) return refuse('wrong-state', 'You cannot change your own role; ask another admin.');
  try {
    await auth.api.setRole({ body: { userId: change.userId, role: change.role }, headers });
  } catch {
    return refuse('invalid', 'The role could not be changed. The person may no longer exist.');
  }
  return succeed(change.role);
}

export const roleChangedMessage = (role: Role) => `Role changed to ${ROLE_LABELS[role]}.`;

/**
 * A password sign-in from the form page. Misses count against the address and
 * the account; a correct sign-in is never slowed down.
 */
export async function signInWithPassword(
  credentials: z.infer<typeof signInSchema>,
  headers: Headers,
  address: string,
): Promise<Outcome<{ headers: Headers; role: string | undefined }>> {
  const verdict = await signInAllowed(address, credentials.email);
  if (!verdict.allowed) {
    return refuse('rate-limited', `Too many attempts. Wait ${verdict.retryAfterSeconds} seconds, then try again.`, {
      retryAfterSeconds: verdict.retryAfterSeconds,
    });
  }
  try {
    const result = await auth.api.signInEmail({ body: credentials, headers, returnHeaders: true });
    return succeed({ headers: result.headers, role: (result.response.user as { role?: string }).role });
  } catch {
    await recordFailedSignIn(address, credentials.email);
    return refuse('unauthenticated', 'That e-mail and password do not match an account.');
  }
}

/** Asks for a reset link. The same answer whether or not the account exists, so the form reveals nothing. */
export async function requestPasswordReset(email: string, headers: Headers): Promise<Outcome<void>> {
  await auth.api.requestPasswordReset({ body: { email }, headers }).catch(() => undefined);
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
