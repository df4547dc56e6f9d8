import { count } from 'drizzle-orm';
import type { Auth } from '../auth/create-auth';
import type { Database } from '../db/connect';
import { defaultCatalog } from '../../engine/catalog';
import { catalogToRows } from '../catalog-rows';
import { account, brief, clientProfile, deviceClass, rateCard, stateChange, user } from '../db/schema';
import { DEMO_BRIEFS, DEMO_PASSWORD, DEMO_PEOPLE, DEMO_RATE_CARD } from './scenario';
import { lifecycleTo } from './lifecycle';

const DAY = 86_400_000;

/**
 * Seeds the demo scenario into an empty database, all in one transaction.
 * Returns false (and writes nothing) when the database already has people.
 */
export async function seedDemo(db: Database, auth: Auth, now = Date.now()): Promise<boolean> {
  const [existing] = await db.select({ n: count() }).from(user);
  if ((existing?.n ?? 0) > 0) return false;

  const context = await auth.$context;
  const passwordHash = await context.password.hash(DEMO_PASSWORD);
  const ids = new Map(DEMO_PEOPLE.map((p) => [p.key, crypto.randomUUID()]));
  const idOf = (key: string) => {
    const id = ids.get(key);
    if (!id) throw new Error(`Demo scenario names an unknown person: ${key}`);
    return id;
  };
  const engineerId = idOf('engineer');

  await db.transaction(async (tx) => {
    for (const person of DEMO_PEOPLE) {
      const id = idOf(person.key);
      const joined = new Date(now - 40 * DAY);
      await tx.insert(user).values({ id, name: person.name, email: person.email, emailVerified: true, role: person.role, createdAt: joined, updatedAt: joined });
      await tx.insert(account).values({ id: crypto.randomUUID(), accountId: id, providerId: 'credential', userId: id, password: passwordHash, createdAt: joined, updatedAt: joined });
      if (person.company) await tx.insert(clientProfile).values({ userId: id, company: person.company });
    }
    await tx.insert(rateCard).values({ ...DEMO_RATE_CARD, updatedBy: idOf('admin') });
    await tx.insert(deviceClass).values(catalogToRows(defaultCatalog));

    for (const item of DEMO_BRIEFS) {
      const ownerId = idOf(item.owner);
      const briefId = crypto.randomUUID();
      const submittedAt = item.submittedDaysAgo === undefined ? null : new Date(now - item.submittedDaysAgo * DAY);
      const createdAt = new Date((submittedAt?.getTime() ?? now - DAY) - 2 * 3_600_000);
      await tx.insert(brief).values({
        id: briefId,
        ownerId,
        title: item.title,
        status: item.status,
        spec: item.spec,
        notes: item.notes,
        submittedAt,
        createdAt,
        updatedAt: createdAt,
      });
      const steps = lifecycleTo(item.status);
      let at = submittedAt?.getTime() ?? createdAt.getTime();
      for (const [index, step] of steps.entries()) {
        await tx.insert(stateChange).values({
          subjectType: 'brief',
          subjectId: briefId,
          fromStatus: step.from,
          toStatus: step.to,
          actorId: step.by === 'client' ? ownerId : engineerId,
          createdAt: new Date(at),
        });
        at += (index + 1) * 3_600_000 * 5;
      }
    }
  });
  return true;
}
