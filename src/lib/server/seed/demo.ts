import { count } from 'drizzle-orm';
import type { Auth } from '../auth/create-auth';
import type { Database } from '../db/connect';
import { summarise } from '../../brief-summary';
import { briefSchema } from '../../engine/brief';
import { defaultCatalog } from '../../engine/catalog';
import { evaluate } from '../../engine/evaluate';
import { catalogToRows } from '../catalog-rows';
import { account, brief, clientProfile, designRevision, deviceClass, rateCard, stateChange, user } from '../db/schema';
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
      // Submitted briefs carry the engine's verdict, as they would after a real submission.
      const spec = submittedAt ? briefSchema.parse(item.spec) : item.spec;
      const result = submittedAt ? evaluate(briefSchema.parse(item.spec), defaultCatalog) : null;
      await tx.insert(brief).values({
        id: briefId,
        ownerId,
        title: item.title,
        status: item.status,
        spec,
        notes: item.notes,
        submittedAt,
        recommendedTopology: result?.recommended ?? null,
        summary: result ? summarise(result) : null,
        createdAt,
        updatedAt: createdAt,
      });
      if (result && item.revisionNote && result.recommended) {
        await tx.insert(designRevision).values({
          briefId,
          number: 1,
          authorId: engineerId,
          topology: result.recommended,
          weights: briefSchema.parse(item.spec).weights,
          overrides: briefSchema.parse(item.spec).overrides,
          input: spec,
          result,
          note: item.revisionNote,
          createdAt: new Date((submittedAt?.getTime() ?? now) + 4 * 3_600_000),
        });
      }
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
