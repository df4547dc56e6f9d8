import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { migrateDatabase } from '../../../src/lib/platform/db/migrate';
import { consumeRate, refundRate, stricter } from '../../../src/lib/platform/rate-limit/limiter';

const url = `file:${path.join(mkdtempSync(path.join(tmpdir(), 'rw-rate-')), 'rate.db')}`;
const { db, client } = connect(url);
beforeAll(() => migrateDatabase(db, client, url));

describe('database-backed fixed-window limiter', () => {
  const rule = { max: 3, windowMs: 60_000 };
  const t0 = 1_800_000_000_000; // a window boundary: 1.8e12 is a multiple of 60 000

  test('allows max requests per window, then answers with the seconds left', async () => {
    const verdicts = [];
    for (let i = 0; i < 5; i++) verdicts.push(await consumeRate(db, 'k1', rule, t0 + 10_000));
    expect(verdicts.slice(0, 3).every((v) => v.allowed)).toBe(true);
    expect(verdicts[3]).toEqual({ allowed: false, retryAfterSeconds: 50 });
  });

  test('a new window starts the count again; other keys are independent', async () => {
    expect((await consumeRate(db, 'k1', rule, t0 + 60_000)).allowed).toBe(true);
    expect((await consumeRate(db, 'k2', rule, t0 + 10_000)).allowed).toBe(true);
  });

  test('concurrent attempts are all counted (one atomic upsert each)', async () => {
    const verdicts = await Promise.all(Array.from({ length: 20 }, () => consumeRate(db, 'burst', rule, t0 + 5_000)));
    expect(verdicts.filter((v) => v.allowed)).toHaveLength(3);
  });
});

describe('giving back a counted call', () => {
  const rule = { max: 2, windowMs: 60_000 };
  const t0 = 1_800_000_000_000;
  test('a refunded call no longer counts; a refund never goes below zero or reaches another window', async () => {
    await consumeRate(db, 'refund', rule, t0);
    await consumeRate(db, 'refund', rule, t0);
    await refundRate(db, 'refund', rule, t0);
    expect((await consumeRate(db, 'refund', rule, t0 + 1_000)).allowed).toBe(true);
    expect((await consumeRate(db, 'refund', rule, t0 + 2_000)).allowed).toBe(false);
    // A refund for an earlier window leaves the current count alone.
    await consumeRate(db, 'refund', rule, t0 + 60_000);
    await consumeRate(db, 'refund', rule, t0 + 60_000);
    await refundRate(db, 'refund', rule, t0);
    expect((await consumeRate(db, 'refund', rule, t0 + 61_000)).allowed).toBe(false);
    for (let i = 0; i < 5; i++) await refundRate(db, 'empty', rule, t0);
    expect((await consumeRate(db, 'empty', rule, t0)).allowed).toBe(true);
    expect((await consumeRate(db, 'empty', rule, t0)).allowed).toBe(true);
    expect((await consumeRate(db, 'empty', rule, t0)).allowed).toBe(false);
  });

  test('of two verdicts the stricter one stands', () => {
    const open = { allowed: true } as const;
    expect(stricter(open, open)).toEqual(open);
    expect(stricter(open, { allowed: false, retryAfterSeconds: 5 })).toEqual({ allowed: false, retryAfterSeconds: 5 });
    expect(stricter({ allowed: false, retryAfterSeconds: 9 }, { allowed: false, retryAfterSeconds: 5 })).toEqual({
      allowed: false,
      retryAfterSeconds: 9,
    });
  });
});
