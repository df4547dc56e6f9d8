/**
 * The whole stack for one test run: the local stand-ins on free ports and the
 * built app pointed at them. Shared by the integration and browser global setups.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { startFakes } from '../../scripts/fakes';
import { startAppServer } from './app-server';
import { freePort } from './ports';

export const TEST_WEBHOOK_SECRET = 'whsec_railwright_test_secret';
export const TEST_STRIPE_KEY = 'sk_test_railwright_tests';

export async function startStack() {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'railwright-stack-'));
  const appPort = await freePort();
  const fakes = await startFakes({
    stripePort: 0,
    smtpPort: await freePort(),
    mailHttpPort: await freePort(),
    mailDir: path.join(dataDir, 'mail'),
    webhookSecret: TEST_WEBHOOK_SECRET,
    webhookUrl: `http://127.0.0.1:${appPort}/api/v1/payments/webhook`,
  });
  const app = await startAppServer(
    {
      PORT: String(appPort),
      PUBLIC_BASE_URL: `http://127.0.0.1:${appPort}`,
      SMTP_URL: fakes.smtpUrl,
      MAIL_FAKE_HTTP_URL: fakes.mailApiUrl,
      STRIPE_API_BASE: fakes.stripeUrl,
      STRIPE_SECRET_KEY: TEST_STRIPE_KEY,
      STRIPE_WEBHOOK_SECRET: TEST_WEBHOOK_SECRET,
      // As behind one proxy: a test may speak for a client machine of its own with X-Forwarded-For
      // (each new client account does, so the suite's sign-ups do not share one address's limit).
      TRUSTED_PROXY_HOPS: '1',
    },
    dataDir,
  );
  return {
    app,
    fakes,
    async stop() {
      await app.stop();
      await fakes.close();
    },
  };
}
