/**
 * Starts the real built server (`npm start`'s launcher) on a free port with a
 * fresh database file, as the integration and browser tests need it.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { freePort } from './ports';

export interface AppServer {
  baseUrl: string;
  port: number;
  dataDir: string;
  databaseUrl: string;
  env: Record<string, string>;
  process: ChildProcess;
  output: () => string;
  stop(signal?: NodeJS.Signals): Promise<void>;
}

export const TEST_AUTH_SECRET = 'test-secret-0123456789abcdef0123456789abcdef';

export async function startAppServer(extraEnv: Record<string, string> = {}, dataDir?: string): Promise<AppServer> {
  if (!existsSync('dist/server/entry.mjs')) {
    throw new Error('The server is not built. Run `npm run build` first (npm test does it for you).');
  }
  const dir = dataDir ?? mkdtempSync(path.join(tmpdir(), 'railwright-test-'));
  const port = extraEnv.PORT ? Number(extraEnv.PORT) : await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const databaseUrl = `file:${path.join(dir, 'railwright.db')}`;
  const env: Record<string, string> = {
    PATH: process.env.PATH ?? '',
    HOME: process.env.HOME ?? '',
    HOST: '127.0.0.1',
    PORT: String(port),
    DATABASE_URL: databaseUrl,
    UPLOAD_DIR: path.join(dir, 'uploads'),
    BETTER_AUTH_SECRET: TEST_AUTH_SECRET,
    PUBLIC_BASE_URL: baseUrl,
    SEED_DEMO: '1',
    ...extraEnv,
  };
  const child = spawn(process.execPath, ['scripts/start.mjs'], { env, stdio: ['ignore', 'pipe', 'pipe'] });
  let log = '';
  child.stdout?.on('data', (chunk: Buffer) => (log += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (log += chunk.toString()));

  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`The server did not become ready in 30 s:\n${log}`)), 30_000);
    const check = () => {
      if (log.includes('Railwright ready')) {
        clearTimeout(timer);
        resolve();
      }
    };
    child.stdout?.on('data', check);
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`The server exited with ${code} before it was ready:\n${log}`));
    });
  });

  return {
    baseUrl,
    port,
    dataDir: dir,
    databaseUrl,
    env,
    process: child,
    output: () => log,
    stop: (signal = 'SIGTERM') =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null || child.signalCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill(signal);
      }),
  };
}
