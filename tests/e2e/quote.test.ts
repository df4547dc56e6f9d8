import { describe, expect, inject, test } from 'vitest';
import { islandsReady, useBrowser, screenshot, signInThroughForm } from './browser';
import { DEMO } from '../support/client';
import { CLIENT_PASSWORD, mailsTo, railUnderReview } from '../integration/quotes/helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const browser = useBrowser();

describe('a quote from the engineer’s desk to the client’s acceptance', () => {
  test('the engineer drafts, edits and sends after confirming; the client opens the e-mailed link and accepts with a PO number', async () => {
    const rail = await railUnderReview(baseUrl);
    const errors: string[] = [];

    const desk = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const engineer = await desk.newPage();
    engineer.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(engineer, baseUrl, DEMO.engineer);
    await engineer.goto(`${baseUrl}/desk/quotes/new?revisionId=${rail.revisionId}`);
    await engineer.getByLabel('Units to build').fill('2');
    await engineer.getByRole('button', { name: 'Draft the quote' }).click();
    await engineer.waitForURL(/\/desk\/quotes\/[0-9a-f-]{36}$/);
    await islandsReady(engineer);
    const number = ((await engineer.getByRole('heading', { level: 1 }).textContent()) ?? '').replace('Quote ', '').trim();
    expect(number).toMatch(/^RW-\d{4}-\d{4}$/);

    // Add a fixed-price line; the preview follows at once, the stored totals after saving.
    await engineer.getByRole('button', { name: 'Add a line' }).click();
    const row = await engineer.getByRole('textbox', { name: /^Description, line/ }).count();
    await engineer.getByRole('textbox', { name: `Description, line ${row}` }).fill('Enclosure cut-outs and labels');
    await engineer.getByRole('textbox', { name: `Unit price, line ${row}` }).fill('40.00');
    await expect.poll(() => engineer.getByText('Unsaved changes').count()).toBe(1);
    await engineer.getByRole('button', { name: 'Save draft' }).click();
    await engineer.getByText('Saved. The totals below are the stored ones.').waitFor();
    await screenshot(engineer, 'quote-builder');

    // Sending takes a confirming click; backing out sends nothing.
    await engineer.getByRole('button', { name: `Send to ${rail.email}…` }).click();
    await engineer.getByRole('button', { name: 'Not yet' }).click();
    expect(await engineer.getByRole('button', { name: `Send quote ${number}` }).count()).toBe(0);
    await engineer.getByRole('button', { name: `Send to ${rail.email}…` }).click();
    await engineer.getByText(`Send quote ${number} to ${rail.email}?`).waitFor();
    await screenshot(engineer, 'quote-builder-confirm-send');
    await engineer.getByRole('button', { name: `Send quote ${number}` }).click();
    await engineer.waitForURL(/\?sent=1$/);
    await engineer.getByText(`Quote ${number} was e-mailed to ${rail.email}`).waitFor();
    await desk.close();

    // The e-mail as received, and its link.
    const message = (await mailsTo(mailApiUrl, rail.email)).find((m) => m.subject.startsWith('Quote '));
    expect(message?.subject).toContain(number);
    const full = await (await fetch(`${mailApiUrl}/messages/${message?.id}`)).json();
    const link = /https?:\/\/\S+\/quotes\/[0-9a-f-]{36}/.exec(full.text)?.[0];
    expect(link).toBeTruthy();

    const phone = await browser().newContext({ viewport: { width: 390, height: 844 } });
    const client = await phone.newPage();
    client.on('pageerror', (e) => errors.push(e.message));
    await client.goto(link!);
    await client.waitForURL(/\/sign-in/);
    await client.getByLabel('E-mail').fill(rail.email);
    await client.getByLabel('Password').fill(CLIENT_PASSWORD);
    await client.getByRole('button', { name: 'Sign in' }).click();
    await client.waitForURL(link!);
    await client.getByRole('heading', { name: `Quote ${number}` }).waitFor();
    const deposit = client.getByRole('region', { name: 'Deposit' });
    await expect(deposit.textContent()).resolves.toContain('Payment opens once the quote is accepted.');
    expect(await client.getByText('Enclosure cut-outs and labels').count()).toBe(1);
    expect(await client.getByText('confirm against the chosen part’s data').count()).toBeGreaterThan(0);
    expect(await client.getByRole('link', { name: /Download the PDF/ }).getAttribute('href')).toMatch(/\/pdf\?download$/);
    await screenshot(client, 'quote-client-phone');
    // The price table scrolls inside its own box: the page itself never scrolls sideways on a phone.
    expect(await client.evaluate(() => document.scrollingElement!.scrollWidth)).toBeLessThanOrEqual(390);

    // Accepting takes a confirming step on the page, where the purchase-order number is given.
    expect(await client.getByRole('button', { name: `Accept quote ${number}` }).count()).toBe(0);
    await client.getByRole('link', { name: 'Accept…' }).click();
    await client.getByRole('heading', { name: 'Confirm your acceptance' }).waitFor();
    await client.getByLabel('Your purchase-order number (optional)').fill('PO-77120');
    await screenshot(client, 'quote-client-confirm-accept');
    await client.getByRole('button', { name: `Accept quote ${number}` }).click();
    await client.getByText(`quote ${number} is accepted`).waitFor();
    const acceptance = await client.getByRole('region', { name: 'Acceptance' }).textContent();
    expect(acceptance).toContain('Accepted on');
    expect(acceptance).toContain('Purchase order PO-77120');
    expect(await client.getByRole('button', { name: /Accept quote/ }).count()).toBe(0);
    await screenshot(client, 'quote-client-accepted');
    await phone.close();

    expect((await (await rail.client.request(`/api/v1/briefs/${rail.briefId}`)).json()).state).toBe('accepted');
    expect(errors).toEqual([]);
  });
});

describe('a client declines a quote', () => {
  test('the decline asks for a reason on the page, then shows it; the engineer is e-mailed with the brief’s link', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);

    const context = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    await signInThroughForm(page, baseUrl, rail.email, CLIENT_PASSWORD);
    await page.goto(`${baseUrl}/quotes/${quote.id}`);
    await page.getByRole('link', { name: 'Decline…' }).click();
    await page.getByRole('heading', { name: `Decline quote ${quote.number}?` }).waitFor();
    await page.getByLabel('Why are you declining?').fill('We chose to build the rail from a module instead.');
    await screenshot(page, 'quote-client-confirm-decline');
    await page.getByRole('button', { name: `Decline quote ${quote.number}` }).click();
    await page.getByText(`Quote ${quote.number} is declined.`).waitFor();
    const acceptance = await page.getByRole('region', { name: 'Acceptance' }).textContent();
    expect(acceptance).toContain('We chose to build the rail from a module instead.');
    expect(await page.getByRole('link', { name: 'Accept…' }).count()).toBe(0);
    await screenshot(page, 'quote-client-declined');
    await context.close();

    const mails = await (await fetch(`${mailApiUrl}/messages?to=${encodeURIComponent(DEMO.engineer)}`)).json();
    const declined = mails.find((m: { subject: string }) => m.subject === `Quote ${quote.number} declined: ${quote.briefTitle}`);
    expect(declined).toBeTruthy();
  });
});

describe('the admin’s prices and mail', () => {
  test('the rate card reads as a form of labelled figures and the mail log shows a sent quote with its PDF', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);

    const context = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    await signInThroughForm(page, baseUrl, DEMO.admin);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Rate card' }).click();
    await page.getByRole('heading', { name: 'Rate card', level: 1 }).waitFor();
    expect(await page.getByLabel('Hourly rate').inputValue()).toBe('115.00');
    expect(await page.getByLabel('Buck (step-down) switcher').inputValue()).toBe('12');
    await screenshot(page, 'admin-rate-card');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Mail log' }).click();
    const summary = page.getByText(`Quote ${quote.number}: ${'Valve manifold, 12 V at 2 A from the 24 V bus'}`).first();
    await summary.click();
    expect(await page.getByRole('link', { name: `Railwright-quote-${quote.number}.pdf` }).getAttribute('href')).toBe(
      `/api/v1/quotes/${quote.id}/pdf`,
    );
    await screenshot(page, 'admin-mail-log');
    await context.close();
  });
});
