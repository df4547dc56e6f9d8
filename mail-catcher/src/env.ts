import { DEFAULT_DIR, DEFAULT_HTTP_PORT, DEFAULT_SMTP_PORT } from './server.ts';

type Env = Record<string, string | undefined>;

export interface MailCatcherSettings {
  smtpPort: number;
  httpPort: number;
  dir: string;
  host: string;
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

/** The catcher's settings from MAIL_FAKE_SMTP_PORT, MAIL_FAKE_HTTP_PORT, MAIL_FAKE_DIR and MAIL_FAKE_HOST, defaults filled in. */
export function mailCatcherOptionsFromEnv(env: Env): MailCatcherSettings {
  return {
    smtpPort: portFromEnv(env, 'MAIL_FAKE_SMTP_PORT', DEFAULT_SMTP_PORT),
    httpPort: portFromEnv(env, 'MAIL_FAKE_HTTP_PORT', DEFAULT_HTTP_PORT),
    dir: env['MAIL_FAKE_DIR'] || DEFAULT_DIR,
    host: env['MAIL_FAKE_HOST'] || '127.0.0.1',
  };
}
