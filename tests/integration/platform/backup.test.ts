import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { count } from 'drizzle-orm';
import { describe, expect, inject, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { brief, user } from '../../../src/lib/platform/db/schema';
import { DEMO, Visitor } from '../../support/client';

const baseUrl = inject('baseUrl');
const databaseUrl = inject('databaseUrl');

describe('backup while the app runs', () => {
  test('npm run db:backup writes a consistent copy that restores and reads, during writes', async () => {
    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    // Keep the app writing while the copy is taken.
    const writes = Array.from({ length: 20 }, (_, i) =>
      client.request('/api/v1/briefs', { method: 'POST', json: { title: `Backup load ${i}`, spec: {}, submit: false } }),
    );
    const target = path.join(mkdtempSync(path.join(tmpdir(), 'rw-backup-')), 'copy.db');
    const run = spawnSync(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'scripts/db-backup.ts', target], {
      env: { ...process.env, DATABASE_URL: databaseUrl },
      encoding: 'utf8',
    });
    await Promise.all(writes);
    expect(run.status, run.stderr).toBe(0);
    expect(run.stdout).toContain('Backup of');
    expect(existsSync(target)).toBe(true);

    const restored = connect(`file:${target}`);
    const [people] = await restored.db.select({ n: count() }).from(user);
    const [briefs] = await restored.db.select({ n: count() }).from(brief);
    const integrity = await restored.client.execute('PRAGMA integrity_check');
    restored.client.close();
    expect(integrity.rows[0]?.[0]).toBe('ok');
    expect(people?.n).toBeGreaterThanOrEqual(6);
    expect(briefs?.n).toBeGreaterThanOrEqual(5);
  });
});
