import type { StripeFakeOptions } from './server.ts';

/** The app's webhook route on the development server. */
export const DEFAULT_WEBHOOK_URL = 'http://127.0.0.1:4321/api/v1/payments/webhook';

type Env = Record<string, string | undefined>;

export function portFromEnv(env: Env, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`${name} must be a port number from 0 to 65535, got '${raw}'.`);
  }
  return port;
}

/**
 * The stand-in's settings from the environment: STRIPE_FAKE_PORT, STRIPE_FAKE_HOST,
 * STRIPE_FAKE_WEBHOOK_URL (empty for none) and STRIPE_WEBHOOK_SECRET.
 */
export function stripeFakeOptionsFromEnv(env: Env, fallbackPort: number): StripeFakeOptions {
  const webhookUrl = env['STRIPE_FAKE_WEBHOOK_URL'] ?? DEFAULT_WEBHOOK_URL;
  if (webhookUrl !== '') {
    try {
      new URL(webhookUrl);
    } catch {
      throw new Error(`STRIPE_FAKE_WEBHOOK_URL must be an absolute URL such as ${DEFAULT_WEBHOOK_URL}, got '${webhookUrl}'.`);
    }
  }
  const options: StripeFakeOptions = {
    port: portFromEnv(env, 'STRIPE_FAKE_PORT', fallbackPort),
    host: env['STRIPE_FAKE_HOST'] || '127.0.0.1',
    webhookUrl: webhookUrl === '' ? null : webhookUrl,
  };
  const secret = env['STRIPE_WEBHOOK_SECRET'];
  if (secret) options.webhookSecret = secret;
  return options;
}
