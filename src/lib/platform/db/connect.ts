import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { createClient, type Client } from '@libsql/client';
import { drizzle } from 'drizzle-orm/libsql';
import * as schema from './schema';

export type Database = ReturnType<typeof drizzle<typeof schema>>;
/** The handle a `db.transaction` callback receives. */
export type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];
/** Either: for helpers that work alone or inside a caller's transaction. */
export type DbOrTx = Database | Transaction;

export const DEFAULT_DATABASE_URL = 'file:data/railwright.db';

/**
 * Opens the database. Kept free of `astro:env` so scripts (seed, migrate,
 * backup) and tests open it the same way the server does.
 */
export function connect(url: string = DEFAULT_DATABASE_URL, authToken?: string): { db: Database; client: Client } {
  const isFile = url.startsWith('file:');
  if (isFile) {
    const file = url.slice('file:'.length).split('?')[0] ?? '';
    if (file && !file.startsWith(':memory:')) mkdirSync(path.dirname(path.resolve(file)), { recursive: true });
  }
  // `timeout` is the SQLite busy timeout (ms) of every pooled connection:
  // writers queue behind each other instead of failing with SQLITE_BUSY.
  const client = createClient(isFile ? { url, timeout: 5000 } : { url, ...(authToken ? { authToken } : {}) });
  return { db: drizzle(client, { schema }), client };
}

/** WAL lets readers go on while one writer commits; the setting persists in the file. */
export async function preparePragmas(client: Client, url: string): Promise<void> {
  if (!url.startsWith('file:')) return;
  await client.execute('PRAGMA journal_mode = WAL');
  await client.execute('PRAGMA foreign_keys = ON');
}
