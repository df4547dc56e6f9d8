import { newId, unixNow } from '../ids.ts';
import type { ApiEvent } from '../objects.ts';
import type { Delivery, WebhookDispatcher } from './webhook-dispatcher.ts';

export interface EventOrigin {
  apiVersion: string;
  /** The API request that caused the event; null when a payer's action on the hosted page did. */
  requestId: string | null;
  idempotencyKey: string | null;
}

/** Every event the stand-in raised, in order, and its webhook deliveries. */
export class EventLog {
  private readonly deliveries = new Map<string, Delivery>();

  constructor(private readonly dispatcher: WebhookDispatcher | null) {}

  get hasWebhook(): boolean {
    return this.dispatcher !== null;
  }

  publish(type: string, object: unknown, origin: EventOrigin): ApiEvent {
    const event: ApiEvent = {
      id: newId('evt_'),
      object: 'event',
      api_version: origin.apiVersion,
      created: unixNow(),
      // A snapshot: later changes to the object must not show in an event already raised.
      data: { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: this.dispatcher ? 1 : 0,
      request: { id: origin.requestId, idempotency_key: origin.idempotencyKey },
      type,
    };
    const delivery: Delivery = {
      eventId: event.id,
      eventType: type,
      body: JSON.stringify(event, null, 2),
      attempts: [],
      delivered: false,
    };
    this.deliveries.set(event.id, delivery);
    this.dispatcher?.deliver(delivery);
    return event;
  }

  /** Sends an event again, unchanged (same id), as the real service may do. */
  redeliver(eventId: string): Delivery | undefined {
    const delivery = this.deliveries.get(eventId);
    if (delivery) this.dispatcher?.deliver(delivery);
    return delivery;
  }

  list(): Delivery[] {
    return [...this.deliveries.values()];
  }

  close(): void {
    this.dispatcher?.close();
  }
}
