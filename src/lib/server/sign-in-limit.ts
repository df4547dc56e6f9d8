import type { APIContext } from 'astro';
import { config } from './config';
import { db } from './db';
import { tooMany } from './http';
import { consumeRate, RATE_RULES, type RateVerdict } from './rate-limit';

/** Counts one sign-in attempt from this address for this account; shared by the JSON route and the form page. */
export async function consumeSignInAttempt(address: string, email: string): Promise<RateVerdict> {
  if (config.rateLimitDisabled) return { allowed: true };
  const perAddress = await consumeRate(db, `sign-in:ip:${address}`, RATE_RULES.signInPerAddress);
  if (!perAddress.allowed) return perAddress;
  return consumeRate(db, `sign-in:account:${address}:${email.trim().toLowerCase()}`, RATE_RULES.signInPerAccount);
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

/** better-auth's own sign-in route, limited before it runs; answers 429 when over the limit. */
export async function limitSignInApi(context: Pick<APIContext, 'request' | 'url' | 'clientAddress'>): Promise<Response | null> {
  if (context.request.method !== 'POST' || context.url.pathname !== '/api/auth/sign-in/email') return null;
  const verdict = await consumeSignInAttempt(context.clientAddress, await jsonEmail(context.request));
  return verdict.allowed ? null : tooMany(verdict.retryAfterSeconds);
}
