import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');

interface CaughtSummary {
  id: string;
  to: { address: string }[] | string[] | string;
  subject: string;
}

async function latestMailTo(address: string): Promise<{ subject: string; text: string }> {
  for (let attempt = 0; attempt < 50; attempt++) {
    const list = (await (await fetch(`${mailApiUrl}/messages`)).json()) as CaughtSummary[] | { messages: CaughtSummary[] };
    const messages = Array.isArray(list) ? list : list.messages;
    const hit = messages.find((m) => JSON.stringify(m.to).includes(address));
    if (hit) return (await (await fetch(`${mailApiUrl}/messages/${hit.id}`)).json()) as { subject: string; text: string };
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`No mail to ${address} reached the catcher`);
}

describe('password reset by e-mail', () => {
  test('the link in the e-mail sets a new password that then signs in; the old one no longer does', async () => {
    const email = `reset-${Date.now()}@example.test`;
    const person = new Visitor(baseUrl);
    await person.form('/sign-up', { name: 'Rosa Quint', company: 'Quint Labs', email, password: 'first-password-1' });

    const asker = new Visitor(baseUrl);
    const ask = await asker.form('/forgot-password', { email });
    expect(ask.status).toBe(303);
    expect(await (await asker.follow(ask)).text()).toContain('a reset link is on its way');

    const mail = await latestMailTo(email);
    expect(mail.subject).toBe('Reset your Railwright password');
    const link = /http:\/\/\S+\/reset-password\?token=\S+/.exec(mail.text)?.[0];
    expect(link).toBeDefined();
    const token = new URL(link ?? '').searchParams.get('token') ?? '';

    const page = await new Visitor(baseUrl).request(`/reset-password?token=${encodeURIComponent(token)}`);
    expect(await page.text()).toContain('Choose a new password');
    const reset = await new Visitor(baseUrl).form('/reset-password', { token, password: 'second-password-2' });
    expect(reset.status).toBe(303);
    expect(reset.headers.get('location')).toBe('/sign-in?reset=done');

    const reused = await new Visitor(baseUrl).form('/reset-password', { token, password: 'third-password-3' });
    expect(reused.status).toBe(400);
    expect(await reused.text()).toContain('expired or was already used');

    const oldPassword = await new Visitor(baseUrl).request('/api/auth/sign-in/email', {
      method: 'POST',
      json: { email, password: 'first-password-1' },
    });
    expect(oldPassword.status).toBe(401);
    const newPassword = await new Visitor(baseUrl).request('/api/auth/sign-in/email', {
      method: 'POST',
      json: { email, password: 'second-password-2' },
    });
    expect(newPassword.status).toBe(200);

    // The live link reaches the inbox only: the admin's mail log shows the e-mail without it.
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const mailLog = await (await admin.request('/admin/mail')).text();
    expect(mailLog).toContain(email);
    expect(mailLog).toContain('reset-password?token=[withheld');
    expect(mailLog).not.toContain(token);
    expect(mailLog).not.toContain(encodeURIComponent(token));
  });

  test('asking for an unknown address looks the same and sends nothing', async () => {
    const email = `nobody-${Date.now()}@example.test`;
    const asker = new Visitor(baseUrl);
    const ask = await asker.form('/forgot-password', { email });
    expect(ask.status).toBe(303);
    expect(await (await asker.follow(ask)).text()).toContain('a reset link is on its way');
    await new Promise((r) => setTimeout(r, 300));
    const list = await (await fetch(`${mailApiUrl}/messages`)).text();
    expect(list).not.toContain(email);
  });

  test('the answer takes as long for an existing account as for an unknown address', async () => {
    const known: string[] = [];
    for (let i = 0; i < 4; i++) {
      const email = `timed-${Date.now()}-${i}@example.test`;
      const signUp = await new Visitor(baseUrl).form('/sign-up', {
        name: 'Ines Voss',
        company: 'Voss Sensors',
        email,
        password: 'timed-password-1',
      });
      expect(signUp.status).toBe(303);
      known.push(email);
    }
    const timed = async (email: string) => {
      const started = performance.now();
      const response = await new Visitor(baseUrl).form('/forgot-password', { email });
      const elapsed = performance.now() - started;
      expect(response.status).toBe(303);
      // Let the e-mail that follows the answer go out before the next measurement.
      await new Promise((r) => setTimeout(r, 300));
      return elapsed;
    };
    const knownTimes: number[] = [];
    const unknownTimes: number[] = [];
    for (const [i, email] of known.entries()) {
      knownTimes.push(await timed(email));
      unknownTimes.push(await timed(`unknown-${Date.now()}-${i}@example.test`));
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? 0;
    expect(Math.abs(median(knownTimes) - median(unknownTimes))).toBeLessThan(40);
  });
});
