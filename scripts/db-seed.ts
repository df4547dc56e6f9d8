import { migrateDatabase } from '../src/lib/platform/db/migrate';
import { seedDemo } from '../src/lib/demo/seed.server';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../src/lib/demo/scenario';
import { scriptContext } from './server-context';

const { url, db, client, auth } = scriptContext();
await migrateDatabase(db, client, url);
const seeded = await seedDemo(db, auth);
console.log(seeded ? `Demo scenario seeded into ${url}` : `${url} already has people; nothing seeded.`);
if (seeded) for (const p of DEMO_PEOPLE.slice(0, 3)) console.log(`  ${p.role.padEnd(8)} ${p.email}  /  ${DEMO_PASSWORD}`);
client.close();
