/**
 * `npm start`: the production server. Refuses to start without a session
 * secret, then serves Astro's standalone handler (pages, API and the built
 * assets) behind response compression, and waits until the database is
 * migrated (and seeded when SEED_DEMO=1) before saying it is ready.
 */
import http from 'node:http';
import compression from 'compression';
import { readFile } from 'node:fs/promises';
const secret = process.env.BETTER_AUTH_SECRET ?? '';
if (secret.length < 32) {
  console.error(
    'Railwright will not start: BETTER_AUTH_SECRET is missing or shorter than 32 characters.\n' +
      'It signs every session cookie. Generate one with `openssl rand -hex 32` and set it in the environment.',
  );
  process.exit(1);
}

// We listen ourselves: the adapter's own server sends every page, answer and
// script uncompressed, which on a phone costs more than the rendering does.
process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const { handler } = await import('../dist/server/entry.mjs');
// Files the adapter serves itself never pass the middleware; the build wrote their headers.
const staticHeaders = JSON.parse(await readFile(new URL('../dist/server/static-headers.json', import.meta.url), 'utf8'));
const compress = compression();
const port = process.env.PORT ?? '4321';
const listenHost = process.env.HOST ?? '0.0.0.0';
// The socket's peer, for the app's rate limits (src/lib/platform/rate-limit/client-address.ts):
// set on every request, so a caller cannot supply it, and never taken from X-Forwarded-For.
const PEER_HEADER = 'x-railwright-peer';
const server = http.createServer((req, res) => {
  req.headers[PEER_HEADER] = req.socket.remoteAddress ?? '';
  // Set first: an answer of the app carries its own values for the same names, which replace these.
  for (const [name, value] of Object.entries(staticHeaders)) res.setHeader(name, value);
  compress(req, res, () => handler(req, res));
});
server.on('error', (error) => {
  console.error(`Railwright could not listen on ${listenHost}:${port}: ${error.message}`);
  process.exit(1);
});
server.listen(Number(port), listenHost);

const host = process.env.HOST && process.env.HOST !== '0.0.0.0' ? process.env.HOST : '127.0.0.1';
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
