/**
 * A fixed set of engine threads with one queue. The engine is CPU-bound and
 * synchronous; run on the event loop, one evaluation holds up every other
 * request (pages, lists, webhooks) behind it. Here the main thread only parses,
 * checks and writes, and the threads do the arithmetic and the serialization.
 */
import { Worker } from 'node:worker_threads';
import type { RailSpec } from '../../engine/rail-spec';
import type { Catalog } from '../../engine/catalog';
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

interface Pending {
  brief: RailSpec;
  catalog: Catalog;
  resolve: (json: string) => void;
  reject: (error: Error) => void;
}

type Job = Pending & { id: number; timer: NodeJS.Timeout };

interface Slot {
  worker: Worker;
  seenCatalog: number;
  jobs: Map<number, Job>;
}

/**
 * Jobs handed to one thread at a time: two, so that the next job is already in
 * the thread's own queue when it finishes one, instead of waiting for the main
 * thread to notice and send it (the main thread is often busy writing answers).
 */
const IN_FLIGHT_PER_THREAD = 2;

export class EnginePool {
  private readonly slots: Slot[] = [];
  private readonly queue: Pending[] = [];
  private readonly catalogVersions = new WeakMap<Catalog, number>();
  private nextCatalogVersion = 0;
  private nextJobId = 0;
  private closed = false;
  private readonly timeoutMs: number;
  private readonly maxQueue: number;

  constructor(private readonly options: EnginePoolOptions) {
    if (!(options.size >= 1)) throw new Error('An engine pool needs at least one thread.');
    this.timeoutMs = options.timeoutMs ?? 10_000;
    this.maxQueue = options.maxQueue ?? 1024;
    for (let i = 0; i < options.size; i++) this.slots.push(this.spawn());
  }

  get size(): number {
    return this.slots.length;
  }

  /** The evaluation of `brief` against `catalog`, as the JSON text the API answers with. */
  evaluateJson(brief: RailSpec, catalog: Catalog): Promise<string> {
    if (this.closed) return Promise.reject(new Error('The engine pool is closed.'));
    if (this.queue.length >= this.maxQueue) return Promise.reject(new EngineBusyError());
    return new Promise<string>((resolve, reject) => {
      this.queue.push({ brief, catalog, resolve, reject });
      this.dispatch();
    });
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const pending of this.queue.splice(0)) pending.reject(new Error('The engine pool is closed.'));
    await Promise.all(this.slots.map((slot) => slot.worker.terminate()));
  }

  private spawn(): Slot {
    const worker = new Worker(this.options.workerFile);
    // Idle threads must not keep a stopping server alive.
    worker.unref();
    const slot: Slot = { worker, seenCatalog: -1, jobs: new Map() };
    worker.on('message', (reply: EngineReply) => this.settle(slot, reply));
    worker.on('error', (error) => this.replace(slot, error));
    worker.on('exit', (code) => this.replace(slot, new Error(`An engine thread stopped with code ${code}.`)));
    return slot;
  }

  private dispatch(): void {
    while (this.queue.length > 0) {
      const slot = this.leastBusy();
      if (!slot) return;
      const pending = this.queue.shift()!;
      const id = this.nextJobId++;
      const catalogVersion = this.versionOf(pending.catalog);
      const message: EngineJob = { id, brief: pending.brief, catalogVersion };
      if (slot.seenCatalog !== catalogVersion) {
        message.catalog = pending.catalog;
        slot.seenCatalog = catalogVersion;
      }
      const timer = setTimeout(() => this.replace(slot, new Error(`An evaluation ran longer than ${this.timeoutMs} ms.`)), this.timeoutMs);
      slot.jobs.set(id, { ...pending, id, timer });
      slot.worker.ref();
      slot.worker.postMessage(message);
    }
  }

  private leastBusy(): Slot | null {
    let best: Slot | null = null;
    for (const slot of this.slots) {
      if (slot.jobs.size < IN_FLIGHT_PER_THREAD && (!best || slot.jobs.size < best.jobs.size)) best = slot;
    }
    return best;
  }

  private settle(slot: Slot, reply: EngineReply): void {
    const job = slot.jobs.get(reply.id);
    if (!job) return;
    clearTimeout(job.timer);
    slot.jobs.delete(reply.id);
    if (slot.jobs.size === 0) slot.worker.unref();
    if (reply.ok) job.resolve(reply.json);
    else job.reject(Object.assign(new Error(`The engine failed: ${reply.message}`), { stack: reply.stack }));
    this.dispatch();
  }

  /** A thread that failed, hung or stopped: fail the jobs it held, start a fresh thread in its place. */
  private replace(slot: Slot, error: Error): void {
    const index = this.slots.indexOf(slot);
    if (index < 0) return;
    for (const job of slot.jobs.values()) {
      clearTimeout(job.timer);
      job.reject(error);
    }
    slot.jobs.clear();
    slot.worker.removeAllListeners();
    slot.worker.on('error', () => undefined);
    // The thread may already be gone; terminating twice is harmless.
    void slot.worker.terminate();
    if (this.closed) {
      this.slots.splice(index, 1);
      return;
    }
    this.slots[index] = this.spawn();
    this.dispatch();
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
