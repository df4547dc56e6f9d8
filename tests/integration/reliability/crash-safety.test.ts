/**
 * SIGKILL in the middle of a burst of writes, then a restart on the same
 * database: everything that was answered 2xx is there whole, and nothing is
 * half-written (a brief without its history, a submitted brief without its
 * submission record).
 */
import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { connect } from '../../../src/lib/server/db/connect';
import { brief, stateChange } from '../../../src/lib/server/db/schema';
import { startAppServer } from '../../support/app-server';
import { DEMO, Visitor } from '../../support/client';

const SPEC = {
  input: { vMin: 10.8, vNom: 12, vMax: 13.2, rippleVpp: 0.1, source: 'adapter' },
  output: { v: 5, tolerance: 0.05, iMin: 0.05, iTyp: 0.3, iMax: 0.6 },
  noise: { class: 'digital' },
  thermal: { ambientMaxC: 45, airflow: 'still-air' },
};

describe('crash safety', () => {
  test('a server killed mid-burst loses nothing it confirmed and leaves nothing half-written', async () => {
    const first = await startAppServer({ RATE_LIMIT_DISABLED: '1' });
    const client = await new Visitor(first.baseUrl).signIn(DEMO.client);
    const confirmed: string[] = [];
    let stop = false;
    const worker = async (w: number) => {
      for (let i = 0; !stop; i++) {
        try {
          const response = await client.request('/api/v1/briefs', { method: 'POST', json: { title: `Crash ${w}-${i}`, spec: SPEC, submit: true } });
          if (response.status === 201) confirmed.push((await response.json()).id);
        } catch {
          return; // the connection died with the server
        }
      }
    };
    const workers = Array.from({ length: 8 }, (_, w) => worker(w));
    await new Promise((resolve) => setTimeout(resolve, 1_500));
    first.process.kill('SIGKILL');
    stop = true;
    await Promise.all(workers);
    await first.stop();
    expect(confirmed.length).toBeGreaterThan(5);

    // Restart on the same files: migrations run again, nothing is lost.
    const second = await startAppServer({ RATE_LIMIT_DISABLED: '1' }, first.dataDir);
    try {
      const { db, client: sql } = connect(second.databaseUrl);
      const crashBriefs = (await db.select().from(brief)).filter((b) => b.title.startsWith('Crash '));
      const ids = new Set(crashBriefs.map((b) => b.id));
      for (const id of confirmed) expect(ids.has(id), `confirmed brief ${id} is missing`).toBe(true);
      for (const row of crashBriefs) {
        const history = await db.select().from(stateChange).where(eq(stateChange.subjectId, row.id));
        // Every brief that exists is whole: submitted, with its engine summary and both history steps.
        expect(row.status).toBe('submitted');
        expect(row.summary).not.toBeNull();
        expect(history.map((h) => h.toStatus).sort()).toEqual(['draft', 'submitted']);
      }
      const integrity = await sql.execute('PRAGMA integrity_check');
      expect(integrity.rows[0]?.[0]).toBe('ok');
      sql.close();
      const reader = await new Visitor(second.baseUrl).signIn(DEMO.client);
      expect((await reader.request(`/api/v1/briefs/${confirmed[0]}`)).status).toBe(200);
    } finally {
      await second.stop();
    }
  }, 120_000);
});
