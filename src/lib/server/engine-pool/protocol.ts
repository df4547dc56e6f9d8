/** Messages between the server and its engine threads. */
import type { Brief } from '../../engine/brief';
import type { Catalog } from '../../engine/catalog';

export interface EngineJob {
  id: number;
  brief: Brief;
  /** Sent only when this thread has not seen this catalog version yet. */
  catalog?: Catalog;
  catalogVersion: number;
}

/** `json` is the evaluation as UTF-8 JSON, its buffer transferred rather than copied. */
export type EngineReply = { id: number; ok: true; json: Uint8Array<ArrayBuffer> } | { id: number; ok: false; message: string; stack?: string };
