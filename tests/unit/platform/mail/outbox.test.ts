/** The mail outbox: queued with the change, delivered once, retried with growing waits, given up at last. */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, test } from 'vitest';
import { connect } from '../../../../src/lib/platform/db/connect';
import { migrateDatabase } from '../../../../src/lib/platform/db/migrate';
import { mailOutbox } from '../../../../src/lib/platform/db/schema';
import { deliverDueMail, enqueueMail, MAX_ATTEMPTS, retryWaitMs } from '../../../../src/lib/platform/mail/outbox';
import type { Mailer, OutgoingMail } from '../../../../src/lib/platform/mail/transport';

const url = `file:${path.join(mkdtempSync(path.join(tmpdir(), 'rw-outbox-')), 'outbox.db')}`;
const { db, client } = connect(url);

beforeAll(async () => {
  await migrateDatabase(db, client, url);
});

/** A mail server that takes mail while `up`, and remembers what it took. */
function fakeServer() {
  const taken: OutgoingMail[] = [];
  const server = { up: true, taken, calls: 0 };
  const mailer: Mailer = {
    async send(mail) {
      server.calls++;
      await new Promise((resolve) => setTimeout(resolve, 5));
      if (!server.up) return { ok: false, error: 'connection refused' };
      taken.push(mail);
      return { ok: true, messageId: `<${taken.length}@test>` };
    },
  };
  return { server, mailer };
}

const mail = (subject: string): OutgoingMail => ({
  kind: 'test',
  to: 'client@example.test',
  subject,
  text: 'Hello',
  html: '<p>Hello</p>',
  attachments: [{ filename: 'q.pdf', contentType: 'application/pdf', content: Buffer.from('%PDF-1.4 test') }],
  relatedId: subject,
});

describe('the mail outbox', () => {
  test('a mail queued in a transaction that rolls back is never sent', async () => {
    const { server, mailer } = fakeServer();
    await expect(
      db.transaction(async (tx) => {
        await enqueueMail(tx, [mail('rolled back')]);
        throw new Error('the change failed');
      }),
    ).rejects.toThrow('the change failed');
    await deliverDueMail(db, mailer);
    expect(server.taken.map((m) => m.subject)).not.toContain('rolled back');
  });

  test('delivered once with its attachment, even when two workers run at the same time', async () => {
    const { server, mailer } = fakeServer();
    const ids = await db.transaction((tx) => enqueueMail(tx, [mail('once')]));
    const delivered = await Promise.all([
      deliverDueMail(db, mailer, { ids }),
      deliverDueMail(db, mailer, { ids }),
      deliverDueMail(db, mailer),
    ]);
    expect(delivered.reduce((a, b) => a + b, 0)).toBe(1);
    expect(server.taken.filter((m) => m.subject === 'once')).toHaveLength(1);
    expect(server.taken[0]?.attachments?.[0]?.content.toString()).toBe('%PDF-1.4 test');
    expect(server.taken[0]?.html).toBe('<p>Hello</p>');
    const [row] = await db
      .select()
      .from(mailOutbox)
      .where(eq(mailOutbox.id, ids[0] ?? ''));
    expect(row).toMatchObject({ state: 'sent', attempts: 1, claimedUntil: null });
  });

  test('a refused mail waits longer after each try, is sent when the server is back, and is given up after the last try', async () => {
    const { server, mailer } = fakeServer();
    server.up = false;
    const [id = ''] = await db.transaction((tx) => enqueueMail(tx, [mail('retried')]));
    const row = async () => (await db.select().from(mailOutbox).where(eq(mailOutbox.id, id)))[0];

    await deliverDueMail(db, mailer, { ids: [id] });
    const first = await row();
    expect(first).toMatchObject({ state: 'queued', attempts: 1, lastError: 'connection refused' });
    // Not due again before its wait has passed.
    expect(await deliverDueMail(db, mailer, { ids: [id], now: new Date(Date.now() + retryWaitMs(1) - 1_000) })).toBe(0);
    expect(server.calls).toBe(1);

    server.up = true;
    expect(await deliverDueMail(db, mailer, { ids: [id], now: new Date(Date.now() + retryWaitMs(1) + 1_000) })).toBe(1);
    expect(await row()).toMatchObject({ state: 'sent', attempts: 2 });

    server.up = false;
    const [doomed = ''] = await db.transaction((tx) => enqueueMail(tx, [mail('doomed')]));
    let at = Date.now();
    for (let i = 0; i < MAX_ATTEMPTS + 2; i++) {
      await deliverDueMail(db, mailer, { ids: [doomed], now: new Date(at) });
      at += retryWaitMs(MAX_ATTEMPTS) + 1_000;
    }
    const [given] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, doomed));
    expect(given).toMatchObject({ state: 'failed', attempts: MAX_ATTEMPTS });
  });

  test('waits grow 30 s, 1 min, 2 min … and stop at 4 h', () => {
    expect([1, 2, 3].map(retryWaitMs)).toEqual([30_000, 60_000, 120_000]);
    expect(retryWaitMs(20)).toBe(4 * 3_600_000);
  });
});
