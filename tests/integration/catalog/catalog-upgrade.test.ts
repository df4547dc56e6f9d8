/** A database seeded by an earlier version gets this version's device classes at start, keeping its own figures. */
import { eq } from 'drizzle-orm';
import { expect, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { deviceClass } from '../../../src/lib/platform/db/schema';
import { startAppServer } from '../../support/app-server';

test('a class the stored catalog lacks is added at start, a field it lacks is filled, an admin’s edit is kept', async () => {
  const first = await startAppServer();
  await first.stop();
  const { db, client } = connect(first.databaseUrl);
  const rows = await db.select().from(deviceClass);
  const [missing, thinned, edited] = rows.filter((row) => row.kind === 'linearRegulators');
  if (!missing || !thinned || !edited) throw new Error('the seeded catalog has fewer than three linear classes');
  const { iLimitA, ...withoutLimit } = thinned.params as Record<string, unknown>;
  expect(iLimitA).toBeDefined();
  // As an earlier version would have left it: one class missing, one without a field, one edited by an admin.
  await db.delete(deviceClass).where(eq(deviceClass.id, missing.id));
  await db.update(deviceClass).set({ params: withoutLimit }).where(eq(deviceClass.id, thinned.id));
  await db
    .update(deviceClass)
    .set({ params: { ...(edited.params as Record<string, unknown>), label: 'Our usual LDO' } })
    .where(eq(deviceClass.id, edited.id));
  client.close();

  const second = await startAppServer({}, first.dataDir);
  try {
    const again = connect(second.databaseUrl);
    const after = new Map((await again.db.select().from(deviceClass)).map((row) => [row.id, row.params as Record<string, unknown>]));
    again.client.close();
    expect(after.get(missing.id)).toEqual(missing.params);
    expect(after.get(thinned.id)?.iLimitA).toBe(iLimitA);
    expect(after.get(edited.id)?.label).toBe('Our usual LDO');
  } finally {
    await second.stop();
  }
}, 120_000);
