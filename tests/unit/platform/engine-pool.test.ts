/**
 * The engine threads answer exactly what the engine answers on the main thread,
 * follow catalog changes, survive a failing job, and refuse work past the queue.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { railSpecSchema, type RailSpec } from '../../../src/lib/engine/rail-spec';
import { defaultCatalog, type Catalog } from '../../../src/lib/engine/catalog';
import { DEFAULT_SEED, evaluate, topologySeed } from '../../../src/lib/engine/evaluate';
import { topologyIds } from '../../../src/lib/engine/types';
import { EngineBusyError, EnginePool } from '../../../src/lib/platform/engine-pool/pool';
import { buildEngineWorker } from '../../../src/integrations/engine-worker';
import { DEMO_BRIEFS } from '../../../src/lib/demo/scenario';

const briefs: RailSpec[] = DEMO_BRIEFS.map((b) => railSpecSchema.parse(b.spec));
const decode = (json: string) => JSON.parse(json);
let dir: string;
let workerFile: string;

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), 'railwright-engine-pool-'));
  workerFile = path.join(dir, 'engine-worker.mjs');
  await buildEngineWorker(workerFile);
}, 60_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('engine threads', () => {
  test('each answer is the main-thread evaluation, character for character, with jobs in flight together', async () => {
    const pool = new EnginePool({ workerFile, size: 2 });
    try {
      const answers = await Promise.all(briefs.map((brief) => pool.evaluateJson(brief, defaultCatalog)));
      // Each topology's Monte Carlo runs on its own seed in every thread (a clearer message than the whole text).
      for (const json of answers) {
        const seeds = Object.fromEntries(
          decode(json).options.map((o: { topology: string; monteCarlo: { seed: number } }) => [o.topology, o.monteCarlo.seed]),
        );
        expect(seeds).toEqual(Object.fromEntries(topologyIds.map((id, index) => [id, topologySeed(DEFAULT_SEED, index)])));
      }
      answers.forEach((json, i) => expect(json).toBe(JSON.stringify(evaluate(briefs[i]!, defaultCatalog))));
    } finally {
      await pool.close();
    }
  });

  test('a changed catalog reaches the threads', async () => {
    const pool = new EnginePool({ workerFile, size: 1 });
    const dearer: Catalog = structuredClone(defaultCatalog);
    for (const regulator of dearer.linearRegulators) regulator.costCents *= 10;
    try {
      const before = decode(await pool.evaluateJson(briefs[0]!, defaultCatalog));
      const after = decode(await pool.evaluateJson(briefs[0]!, dearer));
      expect(after).toEqual(JSON.parse(JSON.stringify(evaluate(briefs[0]!, dearer))));
      expect(after).not.toEqual(before);
    } finally {
      await pool.close();
    }
  });

  test('a job that throws fails alone; the thread goes on serving', async () => {
    const pool = new EnginePool({ workerFile, size: 1 });
    try {
      await expect(pool.evaluateJson({} as RailSpec, defaultCatalog)).rejects.toThrow(/The engine failed/);
      expect(decode(await pool.evaluateJson(briefs[1]!, defaultCatalog)).options.length).toBeGreaterThan(0);
    } finally {
      await pool.close();
    }
  });

  test('a job past the time limit is failed', async () => {
    const pool = new EnginePool({ workerFile, size: 1, timeoutMs: 1 });
    try {
      await expect(pool.evaluateJson(briefs[2]!, defaultCatalog)).rejects.toThrow(/longer than 1 ms/);
    } finally {
      await pool.close();
    }
  });

  test('past the queue limit new work is refused at once', async () => {
    const pool = new EnginePool({ workerFile, size: 1, maxQueue: 1 });
    try {
      // Two jobs go to the thread, one waits in the queue, the fourth is refused.
      const accepted = briefs.slice(0, 3).map((brief) => pool.evaluateJson(brief, defaultCatalog));
      await expect(pool.evaluateJson(briefs[3]!, defaultCatalog)).rejects.toBeInstanceOf(EngineBusyError);
      await Promise.all(accepted);
    } finally {
      await pool.close();
    }
  });
});
