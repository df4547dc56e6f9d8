/**
 * An engine thread: evaluates briefs off the server's event loop and answers
 * with the evaluation already serialized, so the main thread only writes it out.
 * Built to `dist/server/engine-worker.mjs` by the engine-worker integration.
 */
import { parentPort } from 'node:worker_threads';
import type { Catalog } from '../../engine/catalog';
import { evaluate } from '../../engine/evaluate';
import type { EngineJob, EngineReply } from './protocol';

let catalog: Catalog | null = null;
let catalogVersion = -1;

parentPort?.on('message', (job: EngineJob) => {
  if (job.catalog) {
    catalog = job.catalog;
    catalogVersion = job.catalogVersion;
  }
  let reply: EngineReply;
  if (!catalog || catalogVersion !== job.catalogVersion) {
    reply = { id: job.id, ok: false, message: `Engine thread has catalog version ${catalogVersion}, job needs ${job.catalogVersion}.` };
  } else {
    try {
      reply = { id: job.id, ok: true, json: JSON.stringify(evaluate(job.brief, catalog)) };
    } catch (error) {
      const failure = error instanceof Error ? error : new Error(String(error));
      reply = { id: job.id, ok: false, message: failure.message, ...(failure.stack ? { stack: failure.stack } : {}) };
    }
  }
  parentPort?.postMessage(reply);
});
