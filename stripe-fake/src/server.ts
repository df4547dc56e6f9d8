import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { handleApi } from './api/api-handler.ts';
import { SUPPORTED_CALLS } from './api/api-routes.ts';
import { handleCheckout } from './checkout/checkout-routes.ts';
import { EventLog } from './webhooks/event-log.ts';
import { handleFake } from './fake-routes.ts';
import { BodyTooLargeError, send, sendJson } from './http-io.ts';
import { IdempotencyStore } from './api/idempotency.ts';
import type { FakeServices } from './services.ts';
import { FakeState } from './state.ts';
import { WebhookDispatcher } from './webhooks/webhook-dispatcher.ts';

export const DEFAULT_PORT = 12111;
export const DEFAULT_WEBHOOK_SECRET = 'whsec_railwright_dev';
const DEFAULT_RETRY_DELAYS_MS = [500, 1000, 2000, 4000] as const;

export interface StripeFakeOptions {
  /** 0 picks a free port; read the chosen one from the result. Default 12111. */
  port?: number;
  /** Default 127.0.0.1. */
  host?: string;
  /** Where signed events are posted; without it events are only recorded (see GET /__fake/events). */
  webhookUrl?: string | null;
  /** The endpoint secret events are signed with. Default `whsec_railwright_dev`. */
  webhookSecret?: string;
  /** Waits before each retry of a failed delivery. Default 0.5 s, 1 s, 2 s, 4 s. */
  webhookRetryDelaysMs?: readonly number[];
  /** Receives a line for each failed delivery; silent by default. */
  log?: (line: string) => void;
}

export interface StripeFake {
  /** The base URL, e.g. http://127.0.0.1:12111; point the SDK's host and port at it. */
  url: string;
  port: number;
  close(): Promise<void>;
}

function listen(server: Server, port: number, host: string): Promise<AddressInfo> {
  return new Promise((resolve, reject) => {
    const onError = (error: NodeJS.ErrnoException) => {
      if (error.code === 'EADDRINUSE') {
        reject(
          new Error(
            `The payment stand-in cannot listen on ${host}:${port}: the port is already in use (is another copy running?). Stop it or choose another port.`,
          ),
        );
      } else {
        reject(error);
      }
    };
    server.once('error', onError);
    server.listen(port, host, () => {
      server.off('error', onError);
      resolve(server.address() as AddressInfo);
    });
  });
}

function intro(baseUrl: string): string {
  return [
    'Local payment stand-in for Railwright development and tests (not the real payment service).',
    `API base: ${baseUrl}/v1 — ${SUPPORTED_CALLS.join(', ')}`,
    `Hosted checkout: ${baseUrl}/checkout/:sessionId`,
    `Test helpers: GET ${baseUrl}/__fake/events, POST ${baseUrl}/__fake/events/:id/redeliver`,
    '',
  ].join('\n');
}

async function route(services: FakeServices, request: IncomingMessage, response: ServerResponse): Promise<void> {
  const url = new URL(request.url ?? '/', services.baseUrl);
  const method = request.method ?? 'GET';
  if (url.pathname.startsWith('/v1/')) return handleApi(services, request, response, url);
  if (url.pathname.startsWith('/checkout/')) return handleCheckout(services, request, response, url.pathname);
  if (url.pathname.startsWith('/__fake/')) return handleFake(services, method, url, response);
  if (url.pathname === '/' && method === 'GET') return send(response, 200, 'text/plain; charset=utf-8', intro(services.baseUrl));
  return send(response, 404, 'text/plain; charset=utf-8', `Nothing at ${url.pathname}.\n\n${intro(services.baseUrl)}`);
}

/** Starts the payment stand-in in this process. */
export async function startStripeFake(options: StripeFakeOptions = {}): Promise<StripeFake> {
  const host = options.host ?? '127.0.0.1';
  const log = options.log ?? (() => {});
  const dispatcher = options.webhookUrl
    ? new WebhookDispatcher({
        url: options.webhookUrl,
        secret: options.webhookSecret ?? DEFAULT_WEBHOOK_SECRET,
        retryDelaysMs: options.webhookRetryDelaysMs ?? DEFAULT_RETRY_DELAYS_MS,
        log,
      })
    : null;
  const services: FakeServices = {
    state: new FakeState(),
    events: new EventLog(dispatcher),
    idempotency: new IdempotencyStore(),
    // Set once the port is known; no request can arrive before that.
    baseUrl: '',
  };
  const server = createServer((request, response) => {
    route(services, request, response).catch((error: unknown) => {
      const message = error instanceof Error ? error.message : String(error);
      if (error instanceof BodyTooLargeError) {
        send(response, 413, 'text/plain; charset=utf-8', message);
        return;
      }
      log(`internal error on ${request.method} ${request.url}: ${error instanceof Error ? error.stack : message}`);
      if (!response.headersSent) sendJson(response, 500, { error: { type: 'api_error', message: `The stand-in failed: ${message}` } });
      else response.destroy();
    });
  });
  const address = await listen(server, options.port ?? DEFAULT_PORT, host);
  services.baseUrl = `http://${host}:${address.port}`;
  return {
    url: services.baseUrl,
    port: address.port,
    close: () =>
      new Promise<void>((resolve, reject) => {
        services.events.close();
        server.close((error) => (error ? reject(error) : resolve()));
        server.closeAllConnections();
      }),
  };
}
