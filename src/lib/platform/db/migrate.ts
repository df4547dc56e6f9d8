import path from 'node:path';
import type { Client } from '@libsql/client';
import { migrate } from 'drizzle-orm/libsql/migrator';
import { preparePragmas, type Database } from './connect';

/** Applies pending drizzle-kit migrations from `drizzle/` (relative to the working directory). */
export async function migrateDatabase(db: Database, client: Client, url: string): Promise<void> {
  await preparePragmas(client, url);
  await migrate(db, { migrationsFolder: process.env.MIGRATIONS_DIR ?? path.resolve('drizzle') });
}
