import { unixNow } from '../ids.ts';
import { signatureHeader } from './webhook-signature.ts';

interface DeliveryAttempt {
  at: string;
  status: number | null;
  error: string | null;
}

/** One event as sent: the exact body that is signed, and what happened to each attempt. */
export interface Delivery {
  eventId: string;
  eventType: string;
  body: string;
  attempts: DeliveryAttempt[];
  delivered: boolean;
}

interface WebhookTarget {
  url: string;
  secret: string;
  /** Waits before each retry; their count is the number of retries after the first attempt. */
  retryDelaysMs: readonly number[];
  log: (line: string) => void;
}

const ATTEMPT_TIMEOUT_MS = 10_000;

/** Posts signed events to the webhook URL, retrying failures with growing waits, never blocking the caller. */
export class WebhookDispatcher {
  private readonly timers = new Set<NodeJS.Timeout>();
  private readonly inFlight = new Set<AbortController>();
  private closed = false;

  constructor(private readonly target: WebhookTarget) {}

  deliver(delivery: Delivery): void {
    void this.attempt(delivery, 0);
  }

  close(): void {
    this.closed = true;
    for (const timer of this.timers) clearTimeout(timer);
    this.timers.clear();
    for (const controller of this.inFlight) controller.abort();
  }

  private async attempt(delivery: Delivery, retry: number): Promise<void> {
    if (this.closed) return;
    const controller = new AbortController();
    this.inFlight.add(controller);
    const attempt: DeliveryAttempt = { at: new Date().toISOString(), status: null, error: null };
    try {
      // Each attempt is signed afresh, so a late retry still falls inside the receiver's time tolerance.
      const response = await fetch(this.target.url, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': signatureHeader(delivery.body, this.target.secret, unixNow()),
          'user-agent': 'railwright-stripe-fake',
        },
        body: delivery.body,
        signal: AbortSignal.any([controller.signal, AbortSignal.timeout(ATTEMPT_TIMEOUT_MS)]),
      });
      await response.arrayBuffer();
      attempt.status = response.status;
      if (!response.ok) attempt.error = `the receiver answered ${response.status}`;
    } catch (error) {
      attempt.error = error instanceof Error ? (error.cause instanceof Error ? error.cause.message : error.message) : String(error);
    } finally {
      this.inFlight.delete(controller);
    }
    if (this.closed) return;
    delivery.attempts.push(attempt);
    if (attempt.error === null) {
      delivery.delivered = true;
      return;
    }
    const wait = this.target.retryDelaysMs[retry];
    if (wait === undefined) {
      this.target.log(
        `webhook ${delivery.eventType} ${delivery.eventId} to ${this.target.url} failed (${attempt.error}); giving up after ${delivery.attempts.length} attempts`,
      );
      return;
    }
    this.target.log(
      `webhook ${delivery.eventType} ${delivery.eventId} to ${this.target.url} failed (${attempt.error}); retrying in ${wait} ms`,
    );
    const timer = setTimeout(() => {
      this.timers.delete(timer);
      void this.attempt(delivery, retry + 1);
    }, wait);
    this.timers.add(timer);
  }
}
