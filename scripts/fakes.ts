import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { mailCatcherOptionsFromEnv, startMailCatcher } from '../mail-catcher/index.ts';
import { DEFAULT_PORT, DEFAULT_WEBHOOK_SECRET, startStripeFake, stripeFakeOptionsFromEnv } from '../stripe-fake/index.ts';

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
  close(): Promise<void>;
}

type Env = Record<string, string | undefined>;

/** Starts the payment stand-in and the mail catcher; options win over the environment, which wins over defaults. */
export async function startFakes(options: FakesOptions = {}, env: Env = process.env): Promise<Fakes> {
  const stripeFromEnv = stripeFakeOptionsFromEnv(env, DEFAULT_PORT);
  const mailFromEnv = mailCatcherOptionsFromEnv(env);
  const log = options.log ?? (() => {});
  const stripe = await startStripeFake({
    ...stripeFromEnv,
    port: options.stripePort ?? stripeFromEnv.port ?? DEFAULT_PORT,
    webhookUrl: options.webhookUrl === undefined ? stripeFromEnv.webhookUrl ?? null : options.webhookUrl,
    webhookSecret: options.webhookSecret ?? stripeFromEnv.webhookSecret ?? DEFAULT_WEBHOOK_SECRET,
    log: (line) => log(`[payments] ${line}`),
  });
  try {
    const mail = await startMailCatcher({
      ...mailFromEnv,
      ...(options.smtpPort === undefined ? {} : { smtpPort: options.smtpPort }),
      ...(options.mailHttpPort === undefined ? {} : { httpPort: options.mailHttpPort }),
      ...(options.mailDir === undefined ? {} : { dir: options.mailDir }),
      log: (line) => log(`[mail] ${line}`),
    });
    return {
      stripeUrl: stripe.url,
      smtpUrl: mail.smtpUrl,
      mailApiUrl: mail.apiUrl,
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
  const stripeFromEnv = stripeFakeOptionsFromEnv(process.env, DEFAULT_PORT);
  const fakes = await startFakes({ log: (line) => console.error(line) });
  const secret = stripeFromEnv.webhookSecret ?? DEFAULT_WEBHOOK_SECRET;
  console.log(
    [
      'Local stand-ins running (Ctrl+C stops both):',
      `  payments  STRIPE_API_BASE=${fakes.stripeUrl}   checkout pages ${fakes.stripeUrl}/checkout/:id`,
      `            events ${stripeFromEnv.webhookUrl ? `→ ${stripeFromEnv.webhookUrl}, signed with ${secret}` : 'recorded only (STRIPE_FAKE_WEBHOOK_URL is empty)'}`,
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
