import { startStripeFake } from './src/server.ts';
import { stripeFakeOptionsFromEnv } from './src/env.ts';

/** `tsx stripe-fake/cli.ts`: runs the payment stand-in alone, configured from the environment. */
async function main(): Promise<void> {
  const options = stripeFakeOptionsFromEnv(process.env);
  const fake = await startStripeFake({ ...options, log: (line) => console.error(`[stripe-fake] ${line}`) });
  console.log(`payment stand-in listening on ${fake.url} (API ${fake.url}/v1, checkout pages ${fake.url}/checkout/:id)`);
  console.log(
    options.webhookUrl
      ? `signed events go to ${options.webhookUrl} (secret ${options.webhookSecret})`
      : 'no webhook URL set: events are only listed at /__fake/events',
  );
  const stop = () => {
    fake.close().then(
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
