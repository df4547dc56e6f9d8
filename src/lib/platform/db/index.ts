import { config } from '../config';
import { connect } from './connect';
import { migrateDatabase } from './migrate';

export const { db, client } = connect(config.databaseUrl, config.databaseAuthToken);

/** Resolves once migrations (and, when asked, the demo seed) are applied; requests wait on it. */
export const databaseReady: Promise<void> = (async () => {
  await migrateDatabase(db, client, config.databaseUrl);
  if (config.seedDemo) {
    const [{ seedDemo }, { auth }] = await Promise.all([import('../../demo/seed.server'), import('../auth')]);
    await seedDemo(db, auth);
  }
})();
