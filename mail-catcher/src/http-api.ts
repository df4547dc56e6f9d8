import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { MessageStore } from './message-store.ts';
import { summarise, type StoredMessage } from './stored-message.ts';

function sendJson(response: ServerResponse, status: number, body: unknown): void {
  const text = JSON.stringify(body, null, 2);
  response.writeHead(status, {
    'content-type': 'application/json; charset=utf-8',
    'content-length': Buffer.byteLength(text),
    'cache-control': 'no-store',
  });
  response.end(text);
}

function sendBytes(response: ServerResponse, contentType: string, bytes: Buffer, filename: string): void {
  response.writeHead(200, {
    'content-type': contentType,
    'content-length': bytes.length,
    'content-disposition': `attachment; filename*=UTF-8''${encodeURIComponent(filename)}`,
    'cache-control': 'no-store',
  });
  response.end(bytes);
}

function notFound(response: ServerResponse, what: string): void {
  sendJson(response, 404, { error: what });
}

const ROUTES_HELP =
  'The catcher answers GET /messages[?to=address], GET /messages/:id, GET /messages/:id/raw, GET /messages/:id/attachments/:index, DELETE /messages and DELETE /messages/:id.';

function messageWithoutRaw(message: StoredMessage): Omit<StoredMessage, 'rawBase64'> {
  const { rawBase64: _raw, ...rest } = message;
  return rest;
}

async function answer(store: MessageStore, request: IncomingMessage, response: ServerResponse): Promise<void> {
  const url = new URL(request.url ?? '/', 'http://catcher.invalid');
  const method = request.method ?? 'GET';
  const parts = url.pathname.split('/').filter(Boolean);
  if (parts[0] !== 'messages' || parts.length > 4) return notFound(response, `Nothing at ${url.pathname}. ${ROUTES_HELP}`);
  const [, id, sub, index] = parts;

  if (id === undefined) {
    if (method === 'GET') {
      const to = url.searchParams.get('to')?.toLowerCase();
      const messages = (await store.list()).filter(
        (message) => to === undefined || message.envelope.to.some((address) => address.toLowerCase() === to),
      );
      return sendJson(response, 200, messages.map(summarise));
    }
    if (method === 'DELETE') return sendJson(response, 200, { deleted: await store.clear() });
    return sendJson(response, 405, { error: `${method} /messages is not supported. ${ROUTES_HELP}` });
  }

  if (method === 'DELETE' && sub === undefined) {
    return (await store.remove(id)) ? sendJson(response, 200, { deleted: 1 }) : notFound(response, `No message with id ${id}.`);
  }
  if (method !== 'GET') return sendJson(response, 405, { error: `${method} ${url.pathname} is not supported. ${ROUTES_HELP}` });

  const message = await store.get(id);
  if (!message) return notFound(response, `No message with id ${id}.`);
  if (sub === undefined) return sendJson(response, 200, messageWithoutRaw(message));
  if (sub === 'raw' && index === undefined) {
    return sendBytes(response, 'message/rfc822', Buffer.from(message.rawBase64, 'base64'), `${message.id}.eml`);
  }
  if (sub === 'attachments' && index !== undefined) {
    const attachment = /^\d+$/.test(index) ? message.attachments[Number(index)] : undefined;
    if (!attachment) {
      return notFound(
        response,
        `Message ${id} has ${message.attachments.length} attachment(s), numbered from 0; there is no attachment ${index}.`,
      );
    }
    return sendBytes(
      response,
      attachment.contentType,
      Buffer.from(attachment.contentBase64, 'base64'),
      attachment.filename ?? `attachment-${index}`,
    );
  }
  return notFound(response, `Nothing at ${url.pathname}. ${ROUTES_HELP}`);
}

/** The catcher's read side over HTTP, for the app's mail log and for tests. */
export function createHttpApi(store: MessageStore, log: (line: string) => void): Server {
  return createServer((request, response) => {
    answer(store, request, response).catch((error: unknown) => {
      const message = error instanceof Error ? error.message : String(error);
      log(`failed on ${request.method} ${request.url}: ${message}`);
      if (!response.headersSent) sendJson(response, 500, { error: message });
      else response.destroy();
    });
  });
}
