import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Client } from '@libsql/client';

/**
 * A consistent copy of a file database while the app keeps running:
 * `VACUUM INTO` reads one snapshot and writes a compact new file.
 */
export async function backupDatabase(client: Client, url: string, targetFile: string): Promise<string> {
  if (!url.startsWith('file:')) {
    throw new Error('Backups of a libSQL server are taken on the server itself; this command copies file databases.');
  }
  const target = path.resolve(targetFile);
  mkdirSync(path.dirname(target), { recursive: true });
  await client.execute({ sql: 'VACUUM INTO ?', args: [target] });
  return target;
}

export function backupFileName(now = new Date()): string {
  return `railwright-${now.toISOString().replace(/[:.]/g, '-')}.db`;
}
