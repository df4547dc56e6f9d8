import type { ServerResponse } from 'node:http';
import { sendJson } from './http-io.ts';
import type { FakeServices } from './services.ts';
import type { Delivery } from './webhooks/webhook-dispatcher.ts';

function describe(delivery: Delivery) {
  return {
    id: delivery.eventId,
    type: delivery.eventType,
    delivered: delivery.delivered,
    attempts: delivery.attempts,
    event: JSON.parse(delivery.body) as unknown,
  };
}

/**
 * Test helpers under `/__fake/`, outside the payment API: `GET /__fake/events[?type=…]` lists the
 * events raised and their webhook attempts; `POST /__fake/events/:id/redeliver` sends one again.
 */
export function handleFake(services: FakeServices, method: string, url: URL, response: ServerResponse): void {
  if (method === 'GET' && url.pathname === '/__fake/events') {
    const type = url.searchParams.get('type');
    const deliveries = services.events.list().filter((delivery) => type === null || delivery.eventType === type);
    sendJson(response, 200, { data: deliveries.map(describe) });
    return;
  }
  const redeliver = /^\/__fake\/events\/([^/]+)\/redeliver$/.exec(url.pathname);
  if (method === 'POST' && redeliver) {
    if (!services.events.hasWebhook) {
      sendJson(response, 409, {
        error: 'No webhook URL is configured, so there is nowhere to deliver to; start the stand-in with a webhook URL.',
      });
      return;
    }
    const delivery = services.events.redeliver(redeliver[1] ?? '');
    if (delivery) sendJson(response, 202, describe(delivery));
    else sendJson(response, 404, { error: `No event ${redeliver[1]} was raised by this stand-in since it started.` });
    return;
  }
  sendJson(response, 404, {
    error: `Unknown helper ${method} ${url.pathname}; the helpers are GET /__fake/events and POST /__fake/events/:id/redeliver.`,
  });
}
