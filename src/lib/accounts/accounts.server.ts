import { APIError } from 'better-auth/api';
import { eq } from 'drizzle-orm';
import type { z } from 'zod';
import type { signUpSchema } from './schemas';
import { auth } from '../platform/auth';
import { isRole, type Role } from '../platform/auth/roles';
import { db } from '../platform/db';
import { clientProfile, user } from '../platform/db/schema';

type SignUp = z.infer<typeof signUpSchema>;
type Outcome = { ok: true; headers: Headers; userId: string } | { ok: false; status: number; message: string };

/** Creates a client account (better-auth) and its company profile, and signs it in. */
export async function registerClient(data: SignUp, headers: Headers): Promise<Outcome> {
  try {
    const result = await auth.api.signUpEmail({
      body: { name: data.name, email: data.email, password: data.password },
      headers,
      returnHeaders: true,
    });
    const userId = result.response.user.id;
    await db.insert(clientProfile).values({ userId, company: data.company }).onConflictDoNothing();
    return { ok: true, headers: result.headers, userId };
  } catch (err) {
    if (err instanceof APIError && err.status === 'UNPROCESSABLE_ENTITY') {
      return { ok: false, status: 409, message: 'An account with this e-mail already exists. Sign in instead, or reset the password.' };
    }
    if (err instanceof APIError) return { ok: false, status: 400, message: err.message || 'The account could not be created.' };
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

/** Role changes go through better-auth's admin plugin so its permission check applies too. */
export async function changeRole(targetId: string, role: Role, headers: Headers): Promise<void> {
  if (!isRole(role)) throw new Error(`Unknown role ${String(role)}`);
  await auth.api.setRole({ body: { userId: targetId, role }, headers });
}
