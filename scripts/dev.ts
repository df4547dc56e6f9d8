/**
 * `npm run dev`: the local stand-ins (payment fake, mail catcher), the database
 * migrated and seeded with the demo scenario, then Astro's dev server.
 */
import { spawn } from 'node:child_process';
import { migrateDatabase } from '../src/lib/platform/db/migrate';
import { seedDemo } from '../src/lib/demo/seed.server';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../src/lib/demo/scenario';
import { startFakes } from './fakes';
import { scriptContext } from './server-context';

const port = Number(process.env.PORT ?? 4321);
process.env.PUBLIC_BASE_URL ??= `http://localhost:${port}`;

const fakes = await startFakes({ webhookUrl: `http://127.0.0.1:${port}/api/v1/payments/webhook` });
process.env.STRIPE_API_BASE ??= fakes.stripeUrl;
process.env.SMTP_URL ??= fakes.smtpUrl;
process.env.MAIL_FAKE_HTTP_URL ??= fakes.mailApiUrl;
process.env.STRIPE_WEBHOOK_SECRET ??= fakes.webhookSecret;

const { url, db, client, auth } = scriptContext();
await migrateDatabase(db, client, url);
const seeded = await seedDemo(db, auth);
client.close();

console.log(`
Railwright (development)
  app            ${process.env.PUBLIC_BASE_URL}
  database       ${url}${seeded ? ' (demo scenario seeded)' : ''}
  payment fake   ${fakes.stripeUrl}
  mail catcher   ${fakes.smtpUrl}  (messages: ${fakes.mailApiUrl}/messages)

Demo sign-ins (password ${DEMO_PASSWORD}):
${DEMO_PEOPLE.filter((p) => p.email.endsWith('@demo.railwright.test'))
  .map((p) => `  ${p.role.padEnd(9)} ${p.email}`)
  .join('\n')}
`);

const astro = spawn(process.execPath, ['node_modules/astro/astro.js', 'dev', '--port', String(port), ...process.argv.slice(2)], {
  stdio: 'inherit',
  env: process.env,
});

let stopping = false;
async function stop(code: number) {
  if (stopping) return;
  stopping = true;
  astro.kill('SIGTERM');
  await fakes.close();
  process.exit(code);
}
process.on('SIGINT', () => void stop(0));
process.on('SIGTERM', () => void stop(0));
astro.on('exit', (code) => void stop(code ?? 0));
