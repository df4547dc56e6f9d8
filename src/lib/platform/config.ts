/**
 * The server's settings, read once from Astro's typed environment. The only
 * place (with the config files) that knows where settings come from.
 */
import {
  BETTER_AUTH_SECRET,
  DATABASE_AUTH_TOKEN,
  DATABASE_URL,
  ENGINE_THREADS,
  MAIL_FAKE_HTTP_URL,
  MAIL_FAKE_SMTP_PORT,
  MAIL_FROM,
  PUBLIC_BASE_URL,
  RATE_LIMIT_DISABLED,
  SEED_DEMO,
  SMTP_URL,
  STRIPE_API_BASE,
  STRIPE_SECRET_KEY,
  STRIPE_WEBHOOK_SECRET,
  TRUSTED_PROXY_HOPS,
  UPLOAD_DIR,
} from 'astro:env/server';
import { DEFAULT_DATABASE_URL } from './db/connect';

const production = import.meta.env.PROD;

/** `1`, `true` or `yes` switch a flag on; the README documents `SEED_DEMO=1`. */
const flag = (value: string | undefined) => /^(1|true|yes)$/i.test(value ?? '');

// A development-only secret: sessions signed with it are worthless outside this machine.
const DEV_SECRET = 'railwright-development-secret-not-for-production-use';

function authSecret(): string {
  if (BETTER_AUTH_SECRET && BETTER_AUTH_SECRET.length >= 32) return BETTER_AUTH_SECRET;
  if (production) {
    throw new Error(
      'Railwright will not start in production without BETTER_AUTH_SECRET (at least 32 characters). ' +
        'Generate one with `openssl rand -hex 32` and set it in the environment.',
    );
  }
  return DEV_SECRET;
}

/**
 * Payment settings. Development and tests talk to the local stand-in with test
 * keys; production must name its own keys (an unset STRIPE_API_BASE means the
 * real service).
 */
function paymentSettings() {
  if (production) {
    return { secretKey: STRIPE_SECRET_KEY ?? null, webhookSecret: STRIPE_WEBHOOK_SECRET ?? null, apiBase: STRIPE_API_BASE ?? null };
  }
  return {
    secretKey: STRIPE_SECRET_KEY ?? 'sk_test_railwright_dev',
    webhookSecret: STRIPE_WEBHOOK_SECRET ?? 'whsec_railwright_dev',
    apiBase: STRIPE_API_BASE ?? 'http://127.0.0.1:12111',
  };
}

export const config = {
  production,
  databaseUrl: DATABASE_URL ?? DEFAULT_DATABASE_URL,
  databaseAuthToken: DATABASE_AUTH_TOKEN,
  authSecret: authSecret(),
  /** Where links in e-mails point; falls back to the request's own origin. */
  publicBaseUrl: PUBLIC_BASE_URL,
  smtpUrl: SMTP_URL ?? `smtp://127.0.0.1:${MAIL_FAKE_SMTP_PORT}`,
  mailFrom: MAIL_FROM,
  /** The local mail catcher's HTTP API (development and tests only); unset in production. */
  mailCatcherUrl: MAIL_FAKE_HTTP_URL,
  uploadDir: UPLOAD_DIR ?? 'data/uploads',
  seedDemo: flag(SEED_DEMO),
  /** For load benchmarks only: the sign-in and evaluate limits stop counting. */
  rateLimitDisabled: flag(RATE_LIMIT_DISABLED),
  /**
   * How many proxies of our own stand in front of the app. Each appends the address it saw to
   * X-Forwarded-For, so the client is that many entries from the right; anything further left
   * was written by the caller. 0: the socket's address is the client's.
   */
  trustedProxyHops: TRUSTED_PROXY_HOPS,
  payments: paymentSettings(),
  /** Engine threads for the evaluate route; undefined means one per core but one. */
  engineThreads: ENGINE_THREADS,
} as const;
