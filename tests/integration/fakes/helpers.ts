import { createServer, type IncomingHttpHeaders } from 'node:http';
import type { AddressInfo } from 'node:net';

export interface ReceivedWebhook {
  body: string;
  headers: IncomingHttpHeaders;
  status: number;
  receivedAt: number;
}

export interface WebhookReceiver {
  url: string;
  received: ReceivedWebhook[];
  /** Decides the status of each request; 200 by default. */
  answerWith(decide: (body: string, earlierCopies: number) => number): void;
  close(): Promise<void>;
}

/** A tiny HTTP endpoint standing in for the app's webhook route, keeping the raw bodies it got. */
export async function startWebhookReceiver(): Promise<WebhookReceiver> {
  const received: ReceivedWebhook[] = [];
  let decide: (body: string, earlierCopies: number) => number = () => 200;
  const server = createServer((request, response) => {
    const chunks: Buffer[] = [];
    request.on('data', (chunk: Buffer) => chunks.push(chunk));
    request.on('end', () => {
      const body = Buffer.concat(chunks).toString('utf8');
      const earlierCopies = received.filter((entry) => entry.body === body).length;
      const status = decide(body, earlierCopies);
      received.push({ body, headers: request.headers, status, receivedAt: Date.now() });
      response.writeHead(status).end();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}/webhook`,
    received,
    answerWith: (next) => {
      decide = next;
    },
    close: () =>
      new Promise((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}

/** Polls until `check` returns a value other than undefined, or fails with what it was waiting for. */
export async function eventually<T>(what: string, check: () => T | undefined | Promise<T | undefined>, timeoutMs = 10_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`Timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
}

/** A port nothing listens on right now (bound, read, released). */
export async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  await new Promise((resolve) => server.close(resolve));
  return port;
}
