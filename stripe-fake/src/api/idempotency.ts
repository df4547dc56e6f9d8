import { ApiError } from './api-error.ts';
import type { Param } from './form-params.ts';

interface SavedResponse {
  fingerprint: string;
  status: number;
  body: string;
  savedAt: number;
}

interface Replay {
  status: number;
  body: string;
}

const KEEP_MS = 24 * 60 * 60 * 1000;
const MAX_KEY_LENGTH = 255;

function canonical(value: Param): string {
  if (typeof value === 'string') return JSON.stringify(value);
  const keys = Object.keys(value).sort();
  return `{${keys.map((key) => `${JSON.stringify(key)}:${canonical(value[key] as Param)}`).join(',')}}`;
}

/** What makes two requests "the same" for an idempotency key: endpoint and parameters, in any order. */
export function requestFingerprint(method: string, path: string, params: Param): string {
  return `${method} ${path} ${canonical(params)}`;
}

/**
 * Successful results of POST requests by (API key, idempotency key), kept for a day as the API
 * does. Failed validations are not kept, so a corrected retry with the same key goes through.
 */
export class IdempotencyStore {
  private readonly saved = new Map<string, SavedResponse>();

  replay(apiKey: string, idempotencyKey: string, fingerprint: string): Replay | undefined {
    if (idempotencyKey.length > MAX_KEY_LENGTH) {
      throw new ApiError(400, `Idempotency-Key is ${idempotencyKey.length} characters long; at most ${MAX_KEY_LENGTH} are allowed.`, {
        type: 'idempotency_error',
      });
    }
    const saved = this.saved.get(`${apiKey} ${idempotencyKey}`);
    if (!saved || Date.now() - saved.savedAt > KEEP_MS) return undefined;
    if (saved.fingerprint !== fingerprint) {
      throw new ApiError(
        400,
        `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idempotencyKey}' if you meant to execute a different request.`,
        { type: 'idempotency_error' },
      );
    }
    return { status: saved.status, body: saved.body };
  }

  save(apiKey: string, idempotencyKey: string, fingerprint: string, status: number, body: string): void {
    const now = Date.now();
    for (const [key, entry] of this.saved) {
      if (now - entry.savedAt > KEEP_MS) this.saved.delete(key);
    }
    this.saved.set(`${apiKey} ${idempotencyKey}`, { fingerprint, status, body, savedAt: now });
  }
}
