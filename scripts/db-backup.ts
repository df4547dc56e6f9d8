import path from 'node:path';
import { backupDatabase, backupFileName } from '../src/lib/platform/db/backup';
import { scriptContext } from './server-context';

// `npm run db:backup [target-file]` — default data/backups/railwright-<time>.db
const { url, client } = scriptContext();
const target = process.argv[2] ?? path.join('data', 'backups', backupFileName());
try {
  const written = await backupDatabase(client, url, target);
  console.log(`Backup of ${url} written to ${written}`);
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  client.close();
}
