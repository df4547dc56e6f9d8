/**
 * SIGKILL in the middle of a burst of writes, then a restart on the same
 * database: everything that was answered 2xx is there whole, and nothing is
 * half-written (a brief without its history, a submitted brief without its
 * submission record or its engineers' notice, a quote marked sent whose e-mail
 * is neither delivered nor queued); the restarted server delivers what was queued.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { brief, mailOutbox, quote, quoteLine, stateChange } from '../../../src/lib/platform/db/schema';
import { startFakes } from '../../../scripts/fakes';
import { freePort } from '../../support/ports';
import { railUnderReview } from '../quotes/helpers';
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
    const fakes = await startFakes({
      stripePort: 0,
      webhookUrl: null,
      smtpPort: await freePort(),
      mailHttpPort: await freePort(),
      mailDir: mkdtempSync(path.join(tmpdir(), 'rw-crash-mail-')),
    });
    const env = { RATE_LIMIT_DISABLED: '1', SMTP_URL: fakes.smtpUrl };
    const first = await startAppServer(env);
    const client = await new Visitor(first.baseUrl).signIn(DEMO.client);
    // Drafted quotes, each on its own brief under review, to be sent during the burst.
    const drafts: { id: string; engineer: Visitor }[] = [];
    for (let i = 0; i < 6; i++) {
      const rail = await railUnderReview(first.baseUrl);
      const drafted = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } });
      drafts.push({ id: (await drafted.json()).id, engineer: rail.engineer });
    }
    const confirmed: string[] = [];
    const sentConfirmed: string[] = [];
    let stop = false;
    const worker = async (w: number) => {
      for (let i = 0; !stop; i++) {
        try {
          const response = await client.request('/api/v1/briefs', {
            method: 'POST',
            json: { title: `Crash ${w}-${i}`, spec: SPEC, submit: true },
          });
          if (response.status === 201) confirmed.push((await response.json()).id);
        } catch {
          return; // the connection died with the server
        }
      }
    };
    const workers = Array.from({ length: 8 }, (_, w) => worker(w));
    const sends = drafts.map(async (d, i) => {
      await new Promise((resolve) => setTimeout(resolve, 300 * i));
      try {
        const response = await d.engineer.request(`/api/v1/quotes/${d.id}/send`, { method: 'POST' });
        if (response.status === 200) sentConfirmed.push(d.id);
      } catch {
        // killed mid-send
      }
    });
    // Kill once some of each write are confirmed, while the rest are still in flight.
    const deadline = Date.now() + 20_000;
    while ((confirmed.length < 10 || sentConfirmed.length < 2) && Date.now() < deadline)
      await new Promise((resolve) => setTimeout(resolve, 20));
    first.process.kill('SIGKILL');
    stop = true;
    await Promise.all([...workers, ...sends]);
    await first.stop();
    expect(confirmed.length).toBeGreaterThan(5);
    expect(sentConfirmed.length).toBeGreaterThan(0);

    // Restart on the same files: migrations run again, nothing is lost.
    const second = await startAppServer(env, first.dataDir);
    try {
      const { db, client: sql } = connect(second.databaseUrl);
      const crashBriefs = (await db.select().from(brief)).filter((b) => b.title.startsWith('Crash '));
      const ids = new Set(crashBriefs.map((b) => b.id));
      for (const id of confirmed) expect(ids.has(id), `confirmed brief ${id} is missing`).toBe(true);
      for (const row of crashBriefs) {
        const history = await db.select().from(stateChange).where(eq(stateChange.subjectId, row.id));
        // Every brief that exists is whole: submitted, with its engine summary and both history steps.
        expect(row.state).toBe('submitted');
        expect(row.summary).not.toBeNull();
        expect(history.map((h) => h.toState).sort()).toEqual(['draft', 'submitted']);
        const notices = await db.select().from(mailOutbox).where(eq(mailOutbox.relatedId, row.id));
        expect(notices.length, 'a submitted brief whose engineers were never told').toBeGreaterThan(0);
      }
      // A quote marked sent is whole (sent time, brief quoted) and its e-mail was queued with it.
      for (const d of drafts) {
        const [row] = await db.select().from(quote).where(eq(quote.id, d.id));
        const lines = await db.select().from(quoteLine).where(eq(quoteLine.quoteId, d.id));
        expect(lines.length, 'a quote without its lines').toBeGreaterThan(0);
        if (sentConfirmed.includes(d.id)) expect(row?.state).toBe('sent');
        if (row?.state === 'sent') {
          expect(row.sentAt).not.toBeNull();
          const mails = await db.select().from(mailOutbox).where(eq(mailOutbox.relatedId, d.id));
          expect(mails.length, 'a quote marked sent without its e-mail').toBe(1);
          const [ofBrief] = await db.select().from(brief).where(eq(brief.id, row.briefId));
          expect(ofBrief?.state).toBe('quoted');
        }
      }
      // What the crash left queued goes out from the restarted server (its claim lapses, or it was never claimed).
      const deadline2 = Date.now() + 90_000;
      let waiting = await db.select().from(mailOutbox).where(eq(mailOutbox.state, 'queued'));
      while (waiting.length > 0 && Date.now() < deadline2) {
        await new Promise((resolve) => setTimeout(resolve, 500));
        waiting = await db.select().from(mailOutbox).where(eq(mailOutbox.state, 'queued'));
      }
      expect(waiting, 'mail still queued after the restart').toEqual([]);
      const integrity = await sql.execute('PRAGMA integrity_check');
      expect(integrity.rows[0]?.[0]).toBe('ok');
      sql.close();
      const reader = await new Visitor(second.baseUrl).signIn(DEMO.client);
      expect((await reader.request(`/api/v1/briefs/${confirmed[0]}`)).status).toBe(200);
    } finally {
      await second.stop();
      await fakes.close();
    }
  }, 240_000);
});
