/**
 * An engine thread: evaluates briefs off the server's event loop and answers
 * with the evaluation already serialized, so the main thread only writes it out.
 * It keeps the last catalog it was sent, so a catalog crosses threads once per
 * version rather than with every job. Built to `dist/server/engine-worker.mjs`
 * by the engine-worker integration; piscina runs its default export.
 */
import type { Catalog } from '../../engine/catalog';
import { evaluate } from '../../engine/evaluate';
import type { EngineJob, EngineReply } from './protocol';

let catalog: Catalog | null = null;
let catalogVersion = -1;

export default function runEngineJob(job: EngineJob): EngineReply {
  if (job.catalog) {
    catalog = job.catalog;
    catalogVersion = job.catalogVersion;
  }
  if (!catalog || catalogVersion !== job.catalogVersion) return { kind: 'needs-catalog' };
  try {
    return { kind: 'done', json: JSON.stringify(evaluate(job.brief, catalog)) };
  } catch (error) {
    const failure = error instanceof Error ? error : new Error(String(error));
    return { kind: 'failed', message: failure.message, ...(failure.stack ? { stack: failure.stack } : {}) };
  }
}
