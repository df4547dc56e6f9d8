/**
 * The engine threads, run by piscina. The engine is CPU-bound and synchronous;
 * run on the event loop, one evaluation holds up every other request (pages,
 * lists, webhooks) behind it. Here the main thread only parses, checks and
 * writes, and the threads do the arithmetic and the serialization.
 */
import { Piscina } from 'piscina';
import type { Catalog } from '../../engine/catalog';
import type { RailSpec } from '../../engine/rail-spec';
import type { EngineJob, EngineReply } from './protocol';

export interface EnginePoolOptions {
  workerFile: string | URL;
  size: number;
  /** A job still running after this long is abandoned and its thread replaced. */
  timeoutMs?: number;
  /** Jobs waiting beyond this many are refused at once rather than left to time out. */
  maxQueue?: number;
}

/** The queue is full: the caller should answer 503 with a short Retry-After. */
export class EngineBusyError extends Error {
  constructor() {
    super('Every engine thread is busy and the queue is full.');
    this.name = 'EngineBusyError';
  }
}

/**
 * Jobs handed to one thread at a time: two, so that the next job is already in
 * the thread's own queue when it finishes one, instead of waiting for the main
 * thread to notice and send it (the main thread is often busy writing answers).
 */
const IN_FLIGHT_PER_THREAD = 2;

export class EnginePool {
  private readonly threads: Piscina<EngineJob, EngineReply>;
  private readonly catalogVersions = new WeakMap<Catalog, number>();
  private nextCatalogVersion = 0;
  private readonly timeoutMs: number;
  /** Jobs running or waiting; past `capacity` new work is refused (counted here, so the bound holds from the first job). */
  private outstanding = 0;
  private readonly capacity: number;

  constructor(options: EnginePoolOptions) {
    if (!(options.size >= 1)) throw new Error('An engine pool needs at least one thread.');
    this.timeoutMs = options.timeoutMs ?? 10_000;
    this.capacity = options.size * IN_FLIGHT_PER_THREAD + (options.maxQueue ?? 1024);
    const filename = options.workerFile instanceof URL ? options.workerFile.href : options.workerFile;
    this.threads = new Piscina({
      filename,
      minThreads: options.size,
      maxThreads: options.size,
      concurrentTasksPerWorker: IN_FLIGHT_PER_THREAD,
      // Threads stay up: a cold thread pays the engine's start-up on its first job.
      idleTimeout: Number.POSITIVE_INFINITY,
    });
  }

  get size(): number {
    return this.threads.options.maxThreads;
  }

  /** The evaluation of `brief` against `catalog`, as the JSON text the API answers with. */
  async evaluateJson(brief: RailSpec, catalog: Catalog): Promise<string> {
    if (this.outstanding >= this.capacity) throw new EngineBusyError();
    this.outstanding++;
    try {
      return await this.evaluateOnThread(brief, catalog);
    } finally {
      this.outstanding--;
    }
  }

  async close(): Promise<void> {
    await this.threads.destroy();
  }

  private async evaluateOnThread(brief: RailSpec, catalog: Catalog): Promise<string> {
    const catalogVersion = this.versionOf(catalog);
    let reply = await this.run({ brief, catalogVersion });
    // A thread that has not seen this catalog asks for it once; it keeps it for later jobs.
    if (reply.kind === 'needs-catalog') reply = await this.run({ brief, catalog, catalogVersion });
    if (reply.kind === 'done') return reply.json;
    if (reply.kind === 'failed') throw Object.assign(new Error(`The engine failed: ${reply.message}`), { stack: reply.stack });
    throw new Error('An engine thread did not take the catalog it was sent.');
  }

  private async run(job: EngineJob): Promise<EngineReply> {
    try {
      // Aborting a running job ends its thread; piscina starts a fresh one in its place.
      return await this.threads.run(job, { signal: AbortSignal.timeout(this.timeoutMs) });
    } catch (error) {
      if (error instanceof Error && (error.name === 'AbortError' || error.name === 'TimeoutError')) {
        throw new Error(`An evaluation ran longer than ${this.timeoutMs} ms.`);
      }
      throw error;
    }
  }

  // A catalog is an immutable snapshot; a new object (after an edit or a cache refresh) gets a new number.
  private versionOf(catalog: Catalog): number {
    let version = this.catalogVersions.get(catalog);
    if (version === undefined) {
      version = this.nextCatalogVersion++;
      this.catalogVersions.set(catalog, version);
    }
    return version;
  }
}
