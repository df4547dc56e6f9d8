import { describe, expect, inject, test } from 'vitest';
import { useBrowser, screenshot, signInThroughForm } from './browser';
import { DEMO } from '../support/client';
import { CLIENT_PASSWORD, mailsTo, railUnderReview } from '../integration/quotes/helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const browser = useBrowser();

describe('the deposit', () => {
  test('the client accepts from the e-mailed link, is declined once, pays with the test card and sees the deposit paid; the receipt is in the mail log', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    const message = (await mailsTo(mailApiUrl, rail.email)).find((m) => m.subject.startsWith('Quote '));
    const full = await (await fetch(`${mailApiUrl}/messages/${message?.id}`)).json();
    const link = /https?:\/\/\S+\/quotes\/[0-9a-f-]{36}/.exec(full.text)?.[0] ?? '';

    const context = await browser().newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(link);
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill(rail.email);
    await page.getByLabel('Password').fill(CLIENT_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(new RegExp(`/quotes/${quote.id}$`));
    await page.getByRole('link', { name: 'Accept…' }).click();
    await page.getByRole('button', { name: /^Accept quote/ }).click();
    await page.getByRole('button', { name: 'Pay the deposit' }).waitFor();
    await screenshot(page, 'deposit-accepted');

    await page.getByRole('button', { name: 'Pay the deposit' }).click();
    await page.getByLabel('Card number').waitFor();
    await screenshot(page, 'deposit-checkout');
    await page.getByLabel('Card number').fill('4000 0000 0000 0002');
    await page.getByRole('button', { name: /^Pay/ }).click();
    await page.getByText('Your card was declined.').waitFor();
    await page.getByLabel('Card number').fill('4242 4242 4242 4242');
    await page.getByRole('button', { name: /^Pay/ }).click();

    await page.waitForURL(new RegExp(`/quotes/${quote.id}\\?payment=returned`));
    // The page refreshes itself until the signed webhook has been applied.
    await page.getByText(/Deposit received/).waitFor({ timeout: 20_000 });
    expect(await page.getByText(/Paid on/).count()).toBe(1);
    await screenshot(page, 'deposit-paid');

    await page.goto(`${baseUrl}/briefs/${rail.briefId}`);
    // The state badge beside the title, and the last step of the history.
    expect(await page.locator('h1 + span').textContent()).toContain('Deposit paid');
    expect(await page.getByRole('list', { name: 'State history, oldest first' }).locator('li').last().textContent()).toContain(
      'Accepted → Deposit paid',
    );
    await context.close();

    const admin = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const adminPage = await admin.newPage();
    await signInThroughForm(adminPage, baseUrl, DEMO.admin);
    await adminPage.goto(`${baseUrl}/admin/mail`);
    expect(await adminPage.getByText(`Receipt: deposit of`).first().textContent()).toContain(quote.number);
    await screenshot(adminPage, 'deposit-mail-log');
    await admin.close();
    expect(errors).toEqual([]);
  });

  test('leaving the hosted page without paying brings the client back with nothing charged', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
    await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' });
    await rail.client.request(`/api/v1/quotes/${quote.id}/accept`, { method: 'POST' });
    const context = await browser().newContext();
    const page = await context.newPage();
    await signInThroughForm(page, baseUrl, rail.email, CLIENT_PASSWORD);
    await page.goto(`${baseUrl}/quotes/${quote.id}`);
    await page.getByRole('button', { name: 'Pay the deposit' }).click();
    await page.getByLabel('Card number').waitFor();
    await page
      .getByRole('link', { name: /cancel|back/i })
      .first()
      .click();
    await page.waitForURL(new RegExp(`/quotes/${quote.id}\\?payment=cancelled`));
    await page.getByText('Nothing was charged').waitFor();
    expect(await page.getByRole('button', { name: 'Pay the deposit' }).count()).toBe(1);
    await context.close();
  });
});
