/** What the server hands an engine thread, and what comes back. */
import type { Catalog } from '../../engine/catalog';
import type { RailSpec } from '../../engine/rail-spec';

export interface EngineJob {
  brief: RailSpec;
  /** Sent only when the thread answered that it has not seen this catalog version yet. */
  catalog?: Catalog;
  catalogVersion: number;
}

/** `json` is the evaluation's JSON text; turning it into bytes is left to the main thread. */
export type EngineReply = { kind: 'done'; json: string } | { kind: 'needs-catalog' } | { kind: 'failed'; message: string; stack?: string };
