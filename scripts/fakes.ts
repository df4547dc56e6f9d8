import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { mailCatcherOptionsFromEnv, startMailCatcher } from '../mail-catcher/index.ts';
import { startStripeFake, stripeFakeOptionsFromEnv } from '../stripe-fake/index.ts';

export interface FakesOptions {
  /** Payment stand-in port; default STRIPE_FAKE_PORT or 12111. 0 picks a free port. */
  stripePort?: number;
  /** Where signed events go; default STRIPE_FAKE_WEBHOOK_URL or the dev server's webhook route. null: nowhere. */
  webhookUrl?: string | null;
  /** Default STRIPE_WEBHOOK_SECRET or whsec_railwright_dev. */
  webhookSecret?: string;
  /** Default MAIL_FAKE_SMTP_PORT or 2525. */
  smtpPort?: number;
  /** Default MAIL_FAKE_HTTP_PORT or 2526. */
  mailHttpPort?: number;
  /** Default MAIL_FAKE_DIR or data/mail-catcher. */
  mailDir?: string;
  /** Receives the stand-ins' problem reports (failed webhook deliveries, unstorable mail). */
  log?: (line: string) => void;
}

export interface Fakes {
  /** The payment API base, for STRIPE_API_BASE. */
  stripeUrl: string;
  /** For SMTP_URL. */
  smtpUrl: string;
  /** The mail catcher's HTTP API (messages under /messages). */
  mailApiUrl: string;
  /** Where events are posted (null: recorded only) and the secret they are signed with, for the app's STRIPE_WEBHOOK_SECRET. */
  webhookUrl: string | null;
  webhookSecret: string;
  close(): Promise<void>;
}

type Env = Record<string, string | undefined>;

/** Starts the payment stand-in and the mail catcher; options win over the environment, which wins over defaults. */
export async function startFakes(options: FakesOptions = {}, env: Env = process.env): Promise<Fakes> {
  const stripeSettings = stripeFakeOptionsFromEnv(env);
  const mailSettings = mailCatcherOptionsFromEnv(env);
  const log = options.log ?? (() => {});
  const webhookUrl = options.webhookUrl === undefined ? stripeSettings.webhookUrl : options.webhookUrl;
  const webhookSecret = options.webhookSecret ?? stripeSettings.webhookSecret;
  const stripe = await startStripeFake({
    host: stripeSettings.host,
    port: options.stripePort ?? stripeSettings.port,
    webhookUrl,
    webhookSecret,
    log: (line) => log(`[payments] ${line}`),
  });
  try {
    const mail = await startMailCatcher({
      host: mailSettings.host,
      smtpPort: options.smtpPort ?? mailSettings.smtpPort,
      httpPort: options.mailHttpPort ?? mailSettings.httpPort,
      dir: options.mailDir ?? mailSettings.dir,
      log: (line) => log(`[mail] ${line}`),
    });
    return {
      stripeUrl: stripe.url,
      smtpUrl: mail.smtpUrl,
      mailApiUrl: mail.apiUrl,
      webhookUrl,
      webhookSecret,
      close: async () => {
        await Promise.all([stripe.close(), mail.close()]);
      },
    };
  } catch (error) {
    await stripe.close();
    throw error;
  }
}

async function main(): Promise<void> {
  const fakes = await startFakes({ log: (line) => console.error(line) });
  console.log(
    [
      'Local stand-ins running (Ctrl+C stops both):',
      `  payments  STRIPE_API_BASE=${fakes.stripeUrl}   checkout pages ${fakes.stripeUrl}/checkout/:id`,
      `            events ${fakes.webhookUrl ? `→ ${fakes.webhookUrl}, signed with ${fakes.webhookSecret}` : 'recorded only (STRIPE_FAKE_WEBHOOK_URL is empty)'}`,
      `  mail      SMTP_URL=${fakes.smtpUrl}   messages at ${fakes.mailApiUrl}/messages`,
    ].join('\n'),
  );
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: stopping the stand-ins`);
    fakes.close().then(
      () => process.exit(0),
      (error: unknown) => {
        console.error(error);
        process.exit(1);
      },
    );
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

function isEntryPoint(): boolean {
  const entry = process.argv[1];
  if (!entry) return false;
  try {
    return realpathSync(entry) === realpathSync(fileURLToPath(import.meta.url));
  } catch {
    return false;
  }
}

// Imported (by scripts/dev.ts or tests) it only exports startFakes; run directly it is `npm run fakes`.
if (isEntryPoint()) {
  main().catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    console.error('Ports come from STRIPE_FAKE_PORT (12111), MAIL_FAKE_SMTP_PORT (2525) and MAIL_FAKE_HTTP_PORT (2526).');
    process.exit(1);
  });
}
