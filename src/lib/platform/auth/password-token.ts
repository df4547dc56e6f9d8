import { randomBytes } from 'node:crypto';
import type { DbOrTx } from '../db/connect';
import { verification } from '../db/schema';

/** How long a password-reset link a person asked for works. */
export const RESET_LINK_SECONDS = 60 * 60;

/**
 * A one-time token for better-auth's reset route, written in the caller's
 * transaction: the route reads the `reset-password:<token>` row (its value is
 * the account), refuses it once expired, deletes it when used and ends every
 * session of the account. An account without a password gains one.
 */
export async function issuePasswordToken(tx: DbOrTx, userId: string, lifetimeSeconds: number, now = new Date()): Promise<string> {
  const token = randomBytes(24).toString('base64url');
  await tx.insert(verification).values({
    id: crypto.randomUUID(),
    identifier: `reset-password:${token}`,
    value: userId,
    expiresAt: new Date(now.getTime() + lifetimeSeconds * 1000),
    createdAt: now,
    updatedAt: now,
  });
  return token;
}
