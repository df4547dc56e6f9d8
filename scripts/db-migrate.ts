import { migrateDatabase } from '../src/lib/platform/db/migrate';
import { scriptContext } from './server-context';

const { url, db, client } = scriptContext();
await migrateDatabase(db, client, url);
console.log(`Migrations applied to ${url}`);
client.close();
