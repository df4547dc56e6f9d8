import type { EventLog } from './event-log.ts';
import type { IdempotencyStore } from './idempotency.ts';
import type { FakeState } from './state.ts';

/** What the request handlers share: the state, the events, and the stand-in's own address. */
export interface FakeServices {
  state: FakeState;
  events: EventLog;
  idempotency: IdempotencyStore;
  baseUrl: string;
}
