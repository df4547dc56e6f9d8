/**
 * The server's way to run the engine for the public evaluate route: on the
 * engine threads when the built worker is there, else (development, or
 * ENGINE_THREADS=0) on the event loop. The threads are a per-process cache of
 * capacity, not state: any instance can answer any request.
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Catalog } from '../../engine/catalog';
import type { RailSpec } from '../../engine/rail-spec';
import { evaluate } from '../../engine/evaluate';
import { config } from '../config';
import { log } from '../log';
import { EnginePool } from './pool';

export { EngineBusyError } from './pool';

export const ENGINE_WORKER_FILE = 'engine-worker.mjs';

/** The built worker sits in `dist/server/`, some folders above the chunk or page this code is bundled into. */
function findWorkerFile(): string | null {
  let dir = path.dirname(fileURLToPath(import.meta.url));
  for (let up = 0; up < 5; up++) {
    const candidate = path.join(dir, ENGINE_WORKER_FILE);
    if (existsSync(candidate)) return candidate;
    dir = path.dirname(dir);
  }
  return null;
}

/** One thread per core but one, so the event loop keeps a core; at least one thread. */
export const defaultThreadCount = () => Math.max(1, availableParallelism() - 1);

let pool: EnginePool | null | undefined;

function enginePool(): EnginePool | null {
  if (pool !== undefined) return pool;
  const size = config.engineThreads ?? defaultThreadCount();
  const workerFile = size > 0 ? findWorkerFile() : null;
  pool = workerFile ? new EnginePool({ workerFile, size }) : null;
  log.info({ engineThreads: pool?.size ?? 0 }, pool ? 'engine runs on worker threads' : 'engine runs on the event loop');
  return pool;
}

/** The evaluation of `brief` against `catalog` as JSON text, ready to be the body of the answer. */
export async function evaluateToJson(brief: RailSpec, catalog: Catalog): Promise<string> {
  const threads = enginePool();
  return threads ? threads.evaluateJson(brief, catalog) : JSON.stringify(evaluate(brief, catalog));
}
