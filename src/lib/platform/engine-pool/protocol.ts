/** Messages between the server and its engine threads. */
import type { RailSpec } from '../../engine/rail-spec';
import type { Catalog } from '../../engine/catalog';

export interface EngineJob {
  id: number;
  brief: RailSpec;
  /** Sent only when this thread has not seen this catalog version yet. */
  catalog?: Catalog;
  catalogVersion: number;
}

/** `json` is the evaluation's JSON text; turning it into bytes is left to the main thread, which has time to spare. */
export type EngineReply = { id: number; ok: true; json: string } | { id: number; ok: false; message: string; stack?: string };
