import type { APIContext } from 'astro';
import { config } from '../config';
import { db } from '../db';
import { readLimitedBytes } from '../http/body';
import { refusalResponse, tooMany } from '../http/responses';
import { consumeRate, peekRate, RATE_RULES, type RateVerdict } from './limiter';

/**
 * Only failed sign-ins count: a person who signs in correctly is never slowed
 * down, a guesser is stopped after a few misses. Shared by the JSON route and
 * the form page.
 */
const keys = (address: string, email: string) => ({
  address: `sign-in:ip:${address}`,
  account: `sign-in:account:${address}:${email.trim().toLowerCase()}`,
});

export async function signInAllowed(address: string, email: string): Promise<RateVerdict> {
  if (config.rateLimitDisabled) return { allowed: true };
  const k = keys(address, email);
  const perAddress = await peekRate(db, k.address, RATE_RULES.signInPerAddress);
  if (!perAddress.allowed) return perAddress;
  return peekRate(db, k.account, RATE_RULES.signInPerAccount);
}

export async function recordFailedSignIn(address: string, email: string): Promise<void> {
  if (config.rateLimitDisabled) return;
  const k = keys(address, email);
  await consumeRate(db, k.address, RATE_RULES.signInPerAddress);
  await consumeRate(db, k.account, RATE_RULES.signInPerAccount);
}

function jsonEmail(body: Uint8Array): string {
  try {
    const parsed: unknown = JSON.parse(new TextDecoder().decode(body));
    const email = (parsed as { email?: unknown } | null)?.email;
    return typeof email === 'string' ? email : '';
  } catch {
    return '';
  }
}

/** The most a better-auth request body may hold (sign-in, sign-up, reset: a few hundred bytes). */
const AUTH_BODY_LIMIT = 16 * 1024;

/**
 * better-auth's own routes, behind our byte limit (read while streaming, so a
 * huge chunked body is cut off) and, for the e-mail sign-in, the limit on misses.
 */
export async function guardAuthRoute(
  context: Pick<APIContext, 'request' | 'url' | 'clientAddress'>,
  handler: (request: Request) => Promise<Response>,
): Promise<Response> {
  const { request } = context;
  if (request.method === 'GET' || request.method === 'HEAD') return handler(request);
  const body = await readLimitedBytes(request, AUTH_BODY_LIMIT);
  if (!body.ok) return refusalResponse(body);
  const replay = new Request(request.url, { method: request.method, headers: request.headers, body: body.value });
  if (context.url.pathname !== '/api/auth/sign-in/email') return handler(replay);
  const email = jsonEmail(body.value);
  const verdict = await signInAllowed(context.clientAddress, email);
  if (!verdict.allowed) return tooMany(verdict.retryAfterSeconds);
  const response = await handler(replay);
  if (response.status === 401) await recordFailedSignIn(context.clientAddress, email);
  return response;
}
