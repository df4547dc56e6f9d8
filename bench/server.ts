/** The built production server for the HTTP benchmarks, built first if needed. */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { startAppServer, type AppServer } from '../tests/support/app-server';

export async function startBenchServer(): Promise<AppServer> {
  if (!existsSync('dist/server/entry.mjs')) {
    console.error('Building the production server…');
    execFileSync(process.execPath, ['node_modules/astro/astro.js', 'build'], { stdio: 'inherit' });
  }
  // Limits off: the benchmark is one address hammering the server on purpose.
  // One engine thread, matching the one thread the in-process rate is measured on.
  return startAppServer({ RATE_LIMIT_DISABLED: '1', ENGINE_THREADS: '1' });
}

export async function signedInCookie(baseUrl: string, email: string): Promise<string> {
  const response = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl },
    body: JSON.stringify({ email, password: 'railwright-demo' }),
  });
  if (!response.ok) throw new Error(`Bench sign-in failed: ${response.status}`);
  return response.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}
