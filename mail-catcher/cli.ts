import { mailCatcherOptionsFromEnv } from './src/env.ts';
import { startMailCatcher } from './src/server.ts';

/** `tsx mail-catcher/cli.ts`: runs the mail catcher alone, configured from the environment. */
async function main(): Promise<void> {
  const catcher = await startMailCatcher({
    ...mailCatcherOptionsFromEnv(process.env),
    log: (line) => console.error(`[mail-catcher] ${line}`),
  });
  console.log(`mail catcher: SMTP ${catcher.smtpUrl}, messages at ${catcher.apiUrl}/messages, stored in ${catcher.dir}`);
  const stop = () => {
    catcher.close().then(
      () => process.exit(0),
      (error: unknown) => {
        console.error(error);
        process.exit(1);
      },
    );
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
