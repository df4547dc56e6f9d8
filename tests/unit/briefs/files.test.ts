import { existsSync, mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, test } from 'vitest';
import { connect, type Database } from '../../../src/lib/platform/db/connect';
import { migrateDatabase } from '../../../src/lib/platform/db/migrate';
import { brief, briefFile, user } from '../../../src/lib/platform/db/schema';
import { findBriefFileFor, saveBriefFile } from '../../../src/lib/briefs/files.server';
import { folderStore, type UploadStore } from '../../../src/lib/platform/uploads/store';

const dir = mkdtempSync(path.join(tmpdir(), 'rw-brief-files-'));
const url = `file:${path.join(dir, 'files.db')}`;
const { db, client } = connect(url);
const folder = path.join(dir, 'uploads');
const store = folderStore(folder);
const pdf = new Uint8Array(readFileSync(new URL('../../fixtures/uploads/datasheet.pdf', import.meta.url)));
const csv = new TextEncoder().encode('time (s),current (A)\n0,0.1\n1,0.3\n2,0.1\n4,0.1\n');
const stored = () => (existsSync(folder) ? readdirSync(folder) : []);
const rowsOf = async (briefId: string) => db.select().from(briefFile).where(eq(briefFile.briefId, briefId));

let open = '';
let closed = '';
const owner = { id: 'owner-1', name: 'Ana Owner', email: 'ana@example.test', role: 'client' as const };
const stranger = { id: 'other-1', name: 'Ben Other', email: 'ben@example.test', role: 'client' as const };
const engineer = { id: 'eng-1', name: 'Eve Engineer', email: 'eve@example.test', role: 'engineer' as const };

beforeAll(async () => {
  await migrateDatabase(db, client, url);
  await db.insert(user).values([owner, stranger, engineer].map(({ id, name, email, role }) => ({ id, name, email, role })));
  const [a, b] = await db
    .insert(brief)
    .values([
      { ownerId: owner.id, title: 'Sensor rail', spec: {} },
      { ownerId: owner.id, title: 'Old rail', spec: {}, state: 'cancelled' },
    ])
    .returning({ id: brief.id });
  open = a!.id;
  closed = b!.id;
});

describe('saving a brief file', () => {
  test('writes the bytes under a random key and a row with the safe name', async () => {
    const before = stored().length;
    const outcome = await saveBriefFile(
      { db, store },
      { briefId: open, uploaderId: owner.id, kind: 'datasheet', name: '../../etc/passwd.pdf', bytes: pdf },
    );
    expect(outcome).toMatchObject({
      ok: true,
      value: { name: 'passwd.pdf', kind: 'datasheet', mimeType: 'application/pdf', sizeBytes: pdf.length, loadSummary: null },
    });
    if (!outcome.ok) return;
    const [row] = await db.select().from(briefFile).where(eq(briefFile.id, outcome.value.id));
    expect(row).toMatchObject({ briefId: open, uploadedBy: owner.id, originalName: 'passwd.pdf' });
    expect(stored()).toHaveLength(before + 1);
    expect(await store.get(row!.storageKey)).toEqual(pdf);
  });

  test('a load log carries its reduced figures in the answer and the row', async () => {
    const outcome = await saveBriefFile(
      { db, store },
      { briefId: open, uploaderId: owner.id, kind: undefined, name: 'bench.csv', bytes: csv },
    );
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    // Trapezoids 0.2 + 0.2 + 0.2 = 0.6 A·s over 4 s (see load-log.test.ts for the arithmetic).
    expect(outcome.value.kind).toBe('load-log');
    expect(outcome.value.loadSummary?.iTypA).toBeCloseTo(0.15, 12);
    const [row] = await db.select().from(briefFile).where(eq(briefFile.id, outcome.value.id));
    expect(row?.loadSummary).toEqual(outcome.value.loadSummary);
  });

  test.each([
    ['an empty file', new Uint8Array(), 'datasheet' as const, { kind: 'invalid', code: 'invalid_upload', message: 'The file is empty.' }],
    ['a bad load log', new TextEncoder().encode('0,0.1\n'), 'load-log' as const, { kind: 'invalid', code: 'invalid_load_log' }],
    ['a file over 10 MB', new Uint8Array(10 * 1024 * 1024 + 1), 'other' as const, { kind: 'too-large', code: 'file_too_large' }],
    [
      'a program',
      new Uint8Array([0x4d, 0x5a, 0x90, 0, 3, 0, 0, 0, 4, 0, 0, 0, 0xff, 0xff, 0, 0]),
      'datasheet' as const,
      { kind: 'unsupported-type', code: 'file_type_not_accepted' },
    ],
  ])('%s is refused before anything is written', async (_case, bytes, kind, refusal) => {
    const [files, rows] = [stored().length, (await rowsOf(open)).length];
    const outcome = await saveBriefFile({ db, store }, { briefId: open, uploaderId: owner.id, kind, name: 'x.pdf', bytes });
    expect(outcome).toMatchObject({ ok: false, ...refusal });
    expect(stored()).toHaveLength(files);
    expect(await rowsOf(open)).toHaveLength(rows);
  });

  test('a brief closed by the time the row is written gets no row, and its bytes are removed', async () => {
    const files = stored().length;
    const outcome = await saveBriefFile(
      { db, store },
      { briefId: closed, uploaderId: owner.id, kind: 'datasheet', name: 'late.pdf', bytes: pdf },
    );
    expect(outcome).toEqual({ ok: false, kind: 'wrong-state', message: 'This brief is cancelled; files can no longer be added to it.' });
    expect(stored()).toHaveLength(files);
    expect(await rowsOf(closed)).toHaveLength(0);
  });

  test('a brief that no longer exists gets no row, and the bytes are removed', async () => {
    const files = stored().length;
    const outcome = await saveBriefFile(
      { db, store },
      { briefId: 'gone', uploaderId: owner.id, kind: 'datasheet', name: 'a.pdf', bytes: pdf },
    );
    expect(outcome).toMatchObject({ ok: false, kind: 'not-found' });
    expect(stored()).toHaveLength(files);
  });

  test('when the database write fails the bytes are removed and the error goes on', async () => {
    const files = stored().length;
    const failing = { transaction: () => Promise.reject(new Error('disk I/O error')) } as unknown as Database;
    await expect(
      saveBriefFile({ db: failing, store }, { briefId: open, uploaderId: owner.id, kind: 'datasheet', name: 'a.pdf', bytes: pdf }),
    ).rejects.toThrow('disk I/O error');
    expect(stored()).toHaveLength(files);
  });

  test('when the bytes cannot be stored no row is written', async () => {
    const rows = (await rowsOf(open)).length;
    const full: UploadStore = { ...store, put: () => Promise.reject(new Error('no space left on device')) };
    await expect(
      saveBriefFile({ db, store: full }, { briefId: open, uploaderId: owner.id, kind: 'datasheet', name: 'a.pdf', bytes: pdf }),
    ).rejects.toThrow('no space left');
    expect(await rowsOf(open)).toHaveLength(rows);
  });

  test('many uploads to one brief at once all land', async () => {
    const rows = (await rowsOf(open)).length;
    const outcomes = await Promise.all(
      Array.from({ length: 12 }, (_, k) =>
        saveBriefFile({ db, store }, { briefId: open, uploaderId: owner.id, kind: 'schematic', name: `sheet-${k}.pdf`, bytes: pdf }),
      ),
    );
    expect(outcomes.every((o) => o.ok)).toBe(true);
    expect(await rowsOf(open)).toHaveLength(rows + 12);
  });
});

describe('finding a brief file', () => {
  test('its brief’s owner and staff find it; another client does not', async () => {
    const outcome = await saveBriefFile({ db, store }, { briefId: open, uploaderId: owner.id, kind: 'other', name: 'a.pdf', bytes: pdf });
    if (!outcome.ok) throw new Error('setup upload refused');
    expect((await findBriefFileFor(db, owner, outcome.value.id))?.id).toBe(outcome.value.id);
    expect((await findBriefFileFor(db, engineer, outcome.value.id))?.id).toBe(outcome.value.id);
    expect(await findBriefFileFor(db, stranger, outcome.value.id)).toBeNull();
    expect(await findBriefFileFor(db, engineer, 'no-such-file')).toBeNull();
  });
});
