import type { IncomingMessage, ServerResponse } from 'node:http';
import { ApiError } from './api-error.ts';
import { apiKeyFrom } from './api-keys.ts';
import { matchApiRoute } from './api-routes.ts';
import { parseParams } from './form-params.ts';
import { BodyTooLargeError, readBody, send } from '../http-io.ts';
import { requestFingerprint } from './idempotency.ts';
import { newId } from '../ids.ts';
import type { FakeServices } from '../services.ts';

/** Used when a request names no version; it is the version the SDK in this repository pins. */
const DEFAULT_API_VERSION = '2026-10-28.endive';

const BODY_LIMIT_BYTES = 1024 * 1024;

function header(request: IncomingMessage, name: string): string | undefined {
  const value = request.headers[name];
  return Array.isArray(value) ? value[0] : value;
}

async function readParams(request: IncomingMessage, url: URL) {
  if (request.method !== 'POST') return parseParams(url.searchParams);
  let body: string;
  try {
    body = await readBody(request, BODY_LIMIT_BYTES);
  } catch (error) {
    if (error instanceof BodyTooLargeError) throw new ApiError(413, error.message);
    throw error;
  }
  const contentType = header(request, 'content-type') ?? '';
  if (body !== '' && !contentType.startsWith('application/x-www-form-urlencoded')) {
    throw new ApiError(
      400,
      `The API reads form-encoded bodies (application/x-www-form-urlencoded), not '${contentType || 'no content type'}'.`,
    );
  }
  return parseParams(new URLSearchParams(body));
}

/** Answers one `/v1/…` call: authentication, parameters, idempotent replay, then the route's handler. */
export async function handleApi(services: FakeServices, request: IncomingMessage, response: ServerResponse, url: URL): Promise<void> {
  const method = request.method ?? 'GET';
  const requestId = newId('req_', 14);
  const apiVersion = header(request, 'stripe-version') ?? DEFAULT_API_VERSION;
  const idempotencyKey = method === 'POST' ? (header(request, 'idempotency-key') ?? null) : null;
  const headers: Record<string, string> = { 'request-id': requestId, 'stripe-version': apiVersion };
  if (idempotencyKey !== null) headers['idempotency-key'] = idempotencyKey;
  const reply = (status: number, body: string) => send(response, status, 'application/json; charset=utf-8', body, headers);

  try {
    const apiKey = apiKeyFrom(header(request, 'authorization'));
    const route = matchApiRoute(method, url.pathname);
    const params = await readParams(request, url);
    const fingerprint = requestFingerprint(method, url.pathname, params);
    if (idempotencyKey !== null) {
      const replay = services.idempotency.replay(apiKey, idempotencyKey, fingerprint);
      if (replay) {
        headers['idempotent-replayed'] = 'true';
        reply(replay.status, replay.body);
        return;
      }
    }
    const result = route.handler(services, {
      params,
      ids: route.ids,
      origin: { apiVersion, requestId, idempotencyKey },
    });
    const body = JSON.stringify(result.body, null, 2);
    if (idempotencyKey !== null) services.idempotency.save(apiKey, idempotencyKey, fingerprint, result.status, body);
    reply(result.status, body);
  } catch (error) {
    if (!(error instanceof ApiError)) throw error;
    reply(error.status, JSON.stringify(error.toBody(), null, 2));
  }
}
