import { DEFAULT_PORT, DEFAULT_WEBHOOK_SECRET } from './server.ts';

/** The app's webhook route on the development server. */
const DEFAULT_WEBHOOK_URL = 'http://127.0.0.1:4321/api/v1/payments/webhook';

type Env = Record<string, string | undefined>;

export interface StripeFakeSettings {
  port: number;
  host: string;
  webhookUrl: string | null;
  webhookSecret: string;
}

function portFromEnv(env: Env, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`${name} must be a port number from 0 to 65535, got '${raw}'.`);
  }
  return port;
}

/**
 * The stand-in's settings from STRIPE_FAKE_PORT, STRIPE_FAKE_HOST, STRIPE_FAKE_WEBHOOK_URL
 * (set it empty for no deliveries) and STRIPE_WEBHOOK_SECRET, with the defaults filled in.
 */
export function stripeFakeOptionsFromEnv(env: Env): StripeFakeSettings {
  const webhookUrl = env['STRIPE_FAKE_WEBHOOK_URL'] ?? DEFAULT_WEBHOOK_URL;
  if (webhookUrl !== '' && !URL.canParse(webhookUrl)) {
    throw new Error(`STRIPE_FAKE_WEBHOOK_URL must be an absolute URL such as ${DEFAULT_WEBHOOK_URL}, got '${webhookUrl}'.`);
  }
  return {
    port: portFromEnv(env, 'STRIPE_FAKE_PORT', DEFAULT_PORT),
    host: env['STRIPE_FAKE_HOST'] || '127.0.0.1',
    webhookUrl: webhookUrl === '' ? null : webhookUrl,
    webhookSecret: env['STRIPE_WEBHOOK_SECRET'] || DEFAULT_WEBHOOK_SECRET,
  };
}
