import { spawn } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import nodemailer from 'nodemailer';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakes } from '../../../scripts/fakes.ts';
import { eventually, freePort } from './helpers.ts';

let dir: string;

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'railwright-fakes-'));
});

afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

function stripeAt(url: string): Stripe {
  const { hostname, port } = new URL(url);
  return new Stripe('sk_test_fakes', { host: hostname, port: Number(port), protocol: 'http', maxNetworkRetries: 0 });
}

async function refused(url: string): Promise<boolean> {
  return fetch(url).then(
    () => false,
    () => true,
  );
}

describe('startFakes', () => {
  it('starts both stand-ins in-process and stops both', async () => {
    const fakes = await startFakes({ stripePort: 0, smtpPort: 0, mailHttpPort: 0, mailDir: dir, webhookUrl: null }, {});
    try {
      const session = await stripeAt(fakes.stripeUrl).checkout.sessions.create({
        mode: 'payment',
        line_items: [{ quantity: 1, price_data: { currency: 'gbp', unit_amount: 500, product_data: { name: 'x' } } }],
      });
      expect(session.url?.startsWith(`${fakes.stripeUrl}/checkout/`)).toBe(true);
      await nodemailer
        .createTransport(fakes.smtpUrl)
        .sendMail({ from: 'a@railwright.test', to: 'b@railwright.test', subject: 'hello', text: 'hi' });
      const list = (await (await fetch(`${fakes.mailApiUrl}/messages`)).json()) as { subject: string }[];
      expect(list.map((message) => message.subject)).toContain('hello');
    } finally {
      await fakes.close();
    }
    expect(await refused(fakes.stripeUrl)).toBe(true);
    expect(await refused(`${fakes.mailApiUrl}/messages`)).toBe(true);
  });

  it('takes ports from the environment when no option is given', async () => {
    const [stripePort, smtpPort, httpPort] = [await freePort(), await freePort(), await freePort()];
    const fakes = await startFakes(
      {},
      {
        STRIPE_FAKE_PORT: String(stripePort),
        MAIL_FAKE_SMTP_PORT: String(smtpPort),
        MAIL_FAKE_HTTP_PORT: String(httpPort),
        MAIL_FAKE_DIR: dir,
        STRIPE_FAKE_WEBHOOK_URL: '',
        STRIPE_WEBHOOK_SECRET: 'whsec_from_env',
      },
    );
    try {
      expect(fakes.webhookUrl).toBeNull();
      expect(fakes.webhookSecret).toBe('whsec_from_env');
      expect(fakes.stripeUrl).toBe(`http://127.0.0.1:${stripePort}`);
      expect(fakes.smtpUrl).toBe(`smtp://127.0.0.1:${smtpPort}`);
      expect(fakes.mailApiUrl).toBe(`http://127.0.0.1:${httpPort}`);
    } finally {
      await fakes.close();
    }
  });

  it('lets options win over the environment, and defaults the webhook to the dev server', async () => {
    const fakes = await startFakes(
      { stripePort: 0, smtpPort: 0, mailHttpPort: 0, mailDir: dir, webhookSecret: 'whsec_option' },
      {
        STRIPE_FAKE_PORT: '1',
        STRIPE_WEBHOOK_SECRET: 'whsec_from_env',
      },
    );
    try {
      expect(fakes.stripeUrl).not.toBe('http://127.0.0.1:1');
      expect(fakes.webhookSecret).toBe('whsec_option');
      expect(fakes.webhookUrl).toBe('http://127.0.0.1:4321/api/v1/payments/webhook');
    } finally {
      await fakes.close();
    }
  });

  it('says which setting is wrong', async () => {
    await expect(startFakes({}, { STRIPE_FAKE_PORT: 'twelve' })).rejects.toThrow(
      "STRIPE_FAKE_PORT must be a port number from 0 to 65535, got 'twelve'.",
    );
  });

  it('releases the payment stand-in when the mail catcher cannot start', async () => {
    const stripePort = await freePort();
    const blocker = await startFakes({ stripePort: 0, smtpPort: 0, mailHttpPort: 0, mailDir: dir, webhookUrl: null }, {});
    try {
      const smtpPort = Number(new URL(blocker.smtpUrl).port);
      await expect(startFakes({ stripePort, smtpPort, mailHttpPort: 0, mailDir: dir, webhookUrl: null }, {})).rejects.toThrow(
        'already in use',
      );
      expect(await refused(`http://127.0.0.1:${stripePort}/`)).toBe(true);
    } finally {
      await blocker.close();
    }
  });
});

describe('npm run fakes', () => {
  it('prints the addresses and stops cleanly on SIGTERM', async () => {
    const [stripePort, smtpPort, httpPort] = [await freePort(), await freePort(), await freePort()];
    const child = spawn(join(process.cwd(), 'node_modules/.bin/tsx'), ['scripts/fakes.ts'], {
      env: {
        ...process.env,
        STRIPE_FAKE_PORT: String(stripePort),
        MAIL_FAKE_SMTP_PORT: String(smtpPort),
        MAIL_FAKE_HTTP_PORT: String(httpPort),
        MAIL_FAKE_DIR: dir,
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    try {
      await eventually('the stand-ins to report their addresses', () => (output.includes('SMTP_URL=') ? true : undefined), 30_000);
      expect(output).toContain(`STRIPE_API_BASE=http://127.0.0.1:${stripePort}`);
      expect(output).toContain(`SMTP_URL=smtp://127.0.0.1:${smtpPort}`);
      expect(output).toContain(`http://127.0.0.1:${httpPort}/messages`);
      expect((await fetch(`http://127.0.0.1:${httpPort}/messages`)).status).toBe(200);
    } finally {
      child.kill('SIGTERM');
    }
    expect(await exited).toBe(0);
    expect(await refused(`http://127.0.0.1:${stripePort}/`)).toBe(true);
  });
});
