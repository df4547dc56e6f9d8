import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { startAppServer } from '../../support/app-server';

describe('production start', () => {
  test('refuses to start without BETTER_AUTH_SECRET and says why', async () => {
    const child = spawn(process.execPath, ['scripts/start.mjs'], { env: { PATH: process.env.PATH ?? '', PORT: '0' } });
    let output = '';
    child.stderr.on('data', (c: Buffer) => (output += c.toString()));
    const code = await new Promise<number | null>((resolve) => child.on('exit', resolve));
    expect(code).toBe(1);
    expect(output).toContain('BETTER_AUTH_SECRET');
    expect(output).toContain('openssl rand -hex 32');
  });

  test('creates and migrates a fresh database file at start, seeds the demo, and takes sign-ups', async () => {
    const server = await startAppServer();
    try {
      const file = server.databaseUrl.slice('file:'.length);
      expect(existsSync(file)).toBe(true);
      expect(path.dirname(file)).toBe(server.dataDir);
      const signUp = await fetch(`${server.baseUrl}/api/v1/account`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', origin: server.baseUrl },
        body: JSON.stringify({ name: 'Fresh Start', company: 'Fresh Labs', email: 'fresh@example.test', password: 'long-enough-password' }),
      });
      expect(signUp.status).toBe(201);
      const demo = await fetch(`${server.baseUrl}/api/auth/sign-in/email`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', origin: server.baseUrl },
        body: JSON.stringify({ email: 'admin@demo.railwright.test', password: 'railwright-demo' }),
      });
      expect(demo.status).toBe(200);
    } finally {
      await server.stop();
    }
  });
});
