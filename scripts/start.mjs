/**
 * `npm start`: the production server. Refuses to start without a session
 * secret, then runs Astro's standalone server and waits until the database is
 * migrated (and seeded when SEED_DEMO=1) before saying it is ready.
 */
const secret = process.env.BETTER_AUTH_SECRET ?? '';
if (secret.length < 32) {
  console.error(
    'Railwright will not start: BETTER_AUTH_SECRET is missing or shorter than 32 characters.\n' +
      'It signs every session cookie. Generate one with `openssl rand -hex 32` and set it in the environment.',
  );
  process.exit(1);
}

await import('../dist/server/entry.mjs');

const host = process.env.HOST && process.env.HOST !== '0.0.0.0' ? process.env.HOST : '127.0.0.1';
const port = process.env.PORT ?? '4321';
const started = Date.now();
for (;;) {
  try {
    const response = await fetch(`http://${host}:${port}/api/health`);
    if (response.ok) {
      console.log(`Railwright ready on port ${port} (database migrated in ${Date.now() - started} ms)`);
      break;
    }
    console.error(`Railwright health check answered ${response.status}; see the errors above.`);
    process.exit(1);
  } catch {
    if (Date.now() - started > 30_000) {
      console.error('Railwright did not become ready within 30 s.');
      process.exit(1);
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
