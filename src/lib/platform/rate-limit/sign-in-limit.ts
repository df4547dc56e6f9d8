import type { APIContext } from 'astro';
import { config } from '../config';
import { db } from '../db';
import { tooMany } from '../http/responses';
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

async function jsonEmail(request: Request): Promise<string> {
  try {
    const body: unknown = await request.clone().json();
    const email = (body as { email?: unknown } | null)?.email;
    return typeof email === 'string' ? email : '';
  } catch {
    return '';
  }
}

/** better-auth's own sign-in route, with the limit checked before and a miss counted after. */
export async function limitSignInApi(
  context: Pick<APIContext, 'request' | 'url' | 'clientAddress'>,
  next: () => Promise<Response>,
): Promise<Response> {
  if (context.request.method !== 'POST' || context.url.pathname !== '/api/auth/sign-in/email') return next();
  const email = await jsonEmail(context.request);
  const verdict = await signInAllowed(context.clientAddress, email);
  if (!verdict.allowed) return tooMany(verdict.retryAfterSeconds);
  const response = await next();
  if (response.status === 401) await recordFailedSignIn(context.clientAddress, email);
  return response;
}
