import type { APIContext } from 'astro';
import { config } from '../config';
import { db } from '../db';
import { readLimitedBytes } from '../http/body';
import { apiError, refusalResponse, tooMany } from '../http/responses';
import { clientAddressOf } from './client-address';
import { accountKey, consumeRate, RATE_RULES, refundRate, stricter, type RateVerdict } from './limiter';

/** Limits count per address, and per account from any address (so spreading guesses over many machines does not help). */
const keys = (address: string, email: string) => ({
  address: `sign-in:ip:${address}`,
  account: `sign-in:account:${accountKey(email)}`,
});

export interface SignInAttempt {
  verdict: RateVerdict;
  /** A correct sign-in gives its count back: only misses use up the limit. */
  forgive(): Promise<void>;
}

/**
 * Counts a sign-in before it runs (increment-then-check in one statement per
 * key), so thirty parallel guesses cannot all slip in under a limit of eight.
 * Shared by better-auth's JSON route and the form page.
 */
export async function countSignInAttempt(address: string, email: string): Promise<SignInAttempt> {
  if (config.rateLimitDisabled) return { verdict: { allowed: true }, forgive: () => Promise.resolve() };
  const now = Date.now();
  const k = keys(address, email);
  const perAddress = await consumeRate(db, k.address, RATE_RULES.signInPerAddress, now);
  const perAccount = await consumeRate(db, k.account, RATE_RULES.signInPerAccount, now);
  return {
    verdict: stricter(perAddress, perAccount),
    forgive: async () => {
      await refundRate(db, k.address, RATE_RULES.signInPerAddress, now);
      await refundRate(db, k.account, RATE_RULES.signInPerAccount, now);
    },
  };
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

/** The most a better-auth request body may hold (sign-in: a few hundred bytes). */
const AUTH_BODY_LIMIT = 16 * 1024;

const SIGN_IN = '/api/auth/sign-in/email';

/**
 * The better-auth routes the app uses as they are. Everything else that
 * changes an account (sign-up, password reset, names, roles) goes through the
 * app's own routes, where its rules and limits hold.
 */
const OPEN_AUTH_ROUTES = new Set(['GET /api/auth/get-session', `POST ${SIGN_IN}`, 'POST /api/auth/sign-out']);

const closedRoute = () =>
  apiError(404, 'not_found', {
    message:
      'Accounts are changed through Railwright’s own routes: sign up at /sign-up (or POST /api/v1/account), ' +
      'reset a password at /forgot-password, change roles at /admin/users.',
  });

/**
 * better-auth's own routes: only the open ones, behind our byte limit (read
 * while streaming, so a huge chunked body is cut off) and, for the e-mail
 * sign-in, the limit on misses.
 */
export async function guardAuthRoute(
  context: Pick<APIContext, 'request' | 'url' | 'clientAddress'>,
  handler: (request: Request) => Promise<Response>,
): Promise<Response> {
  const { request } = context;
  if (!OPEN_AUTH_ROUTES.has(`${request.method} ${context.url.pathname}`)) return closedRoute();
  if (request.method === 'GET') return handler(request);
  const body = await readLimitedBytes(request, AUTH_BODY_LIMIT);
  if (!body.ok) return refusalResponse(body);
  const replay = new Request(request.url, { method: request.method, headers: request.headers, body: body.value });
  if (context.url.pathname !== SIGN_IN) return handler(replay);
  const attempt = await countSignInAttempt(clientAddressOf(context), jsonEmail(body.value));
  if (!attempt.verdict.allowed) return tooMany(attempt.verdict.retryAfterSeconds);
  const response = await handler(replay);
  if (response.ok) await attempt.forgive();
  return response;
}
