/**
 * What the server does once before its first answer: apply the migrations and,
 * when asked, seed the demo scenario. It lives above the database, auth and
 * mail so that none of them needs another to start.
 */
import { auth } from '~/lib/platform/auth';
import { config } from '~/lib/platform/config';
import { client, db } from '~/lib/platform/db';
import { migrateDatabase } from '~/lib/platform/db/migrate';
import { startMailOutbox } from '~/lib/platform/mail/mailer';
import { bringCatalogUpToDate } from '~/lib/catalog/index.server';

/** Resolves once migrations (and, when asked, the demo seed) are applied; requests wait on it. */
export const serverReady: Promise<void> = (async () => {
  await migrateDatabase(db, client, config.databaseUrl);
  if (config.seedDemo) {
    const { seedDemo } = await import('~/lib/demo/seed.server');
    await seedDemo(db, auth);
  }
  await bringCatalogUpToDate();
  startMailOutbox();
})();
