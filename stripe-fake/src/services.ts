import type { EventLog } from './webhooks/event-log.ts';
import type { IdempotencyStore } from './api/idempotency.ts';
import type { FakeState } from './state.ts';

/** What the request handlers share: the state, the events, and the stand-in's own address. */
export interface FakeServices {
  state: FakeState;
  events: EventLog;
  idempotency: IdempotencyStore;
  baseUrl: string;
}
