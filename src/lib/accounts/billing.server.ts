/** The client's billing address, kept on their profile and copied onto each balance invoice as it is issued. */
import { eq } from 'drizzle-orm';
import { db } from '../platform/db';
import { clientProfile } from '../platform/db/schema';
import type { SignedInUser } from '../platform/http/guard';
import { succeed, type Outcome } from '../platform/outcome';

export async function billingAddressOf(userId: string): Promise<string> {
  const [row] = await db
    .select({ billingAddress: clientProfile.billingAddress })
    .from(clientProfile)
    .where(eq(clientProfile.userId, userId));
  return row?.billingAddress ?? '';
}

/** Saves the address; a client invited without a company gets a profile with it. */
export async function setBillingAddress(client: SignedInUser, billingAddress: string): Promise<Outcome<null>> {
  const tidy = billingAddress
    .split('\n')
    .map((line) => line.trim())
    .filter(Boolean)
    .join('\n');
  await db
    .insert(clientProfile)
    .values({ userId: client.id, company: '', billingAddress: tidy })
    .onConflictDoUpdate({ target: clientProfile.userId, set: { billingAddress: tidy, updatedAt: new Date() } });
  return succeed(null);
}
