import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { islandsReady, screenshot, signInThroughForm, useBrowser } from './browser';
import { DEMO } from '../support/client';
import { CLIENT_PASSWORD, mailsTo, railUnderReview } from '../integration/quotes/helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const browser = useBrowser();

/** The review page's state form: choose the state, send it, wait for the page to say so. */
async function moveBrief(engineer: Page, briefId: string, state: string, note = '') {
  await engineer.goto(`${baseUrl}/desk/briefs/${briefId}`);
  await engineer.getByLabel('Move this brief to').selectOption(state);
  if (note) await engineer.locator('#move-note').fill(note);
  await engineer.getByRole('button', { name: 'Move' }).click();
  await engineer.getByText('State changed; the history below records it.').waitFor();
}

/** Pays on the stand-in's hosted page with the test card. */
async function payWithTestCard(page: Page) {
  await page.getByLabel('Card number').waitFor();
  await page.getByLabel('Card number').fill('4242 4242 4242 4242');
  await page.getByRole('button', { name: /^Pay/ }).click();
}

describe('the working relationship, from a brief sent back to a job paid in full', () => {
  test('changes requested and made, quoted, asked and answered, accepted with a PO, deposit paid, delivered, balance paid; both receipts mailed', async () => {
    const rail = await railUnderReview(baseUrl);
    const errors: string[] = [];

    const desk = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const engineer = await desk.newPage();
    engineer.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(engineer, baseUrl, DEMO.engineer);
    const phone = await browser().newContext({ viewport: { width: 390, height: 844 } });
    const client = await phone.newPage();
    client.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(client, baseUrl, rail.email, CLIENT_PASSWORD);

    // The engineer sends the brief back; the client changes it in the wizard and submits it again.
    await moveBrief(engineer, rail.briefId, 'changes-requested', 'Does the 36 V maximum include load-dump spikes? Please check it.');
    await client.goto(`${baseUrl}/briefs/${rail.briefId}`);
    await client.getByRole('link', { name: 'Change the brief and submit it again' }).click();
    await islandsReady(client);
    const highest = client.getByLabel('Highest input voltage', { exact: true });
    await highest.fill('40');
    await highest.blur();
    for (let step = 0; step < 6 && (await client.getByRole('button', { name: 'Submit the brief' }).count()) === 0; step++)
      await client.getByRole('button', { name: 'Next' }).click();
    await client.getByRole('button', { name: 'Submit the brief' }).click();
    await client.waitForURL(new RegExp(`/briefs/${rail.briefId}\\?submitted=1$`), { timeout: 20_000 });

    // The engineer takes it into review, keeps a revision of the changed brief and quotes it.
    await moveBrief(engineer, rail.briefId, 'in-review');
    const revision = await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`, {
      method: 'POST',
      json: { note: 'Rated for 40 V as agreed' },
    });
    expect(revision.status).toBe(201);
    await engineer.goto(`${baseUrl}/desk/quotes/new?revisionId=${(await revision.json()).id}`);
    await engineer.getByRole('button', { name: 'Draft the quote' }).click();
    await engineer.waitForURL(/\/desk\/quotes\/[0-9a-f-]{36}$/);
    const quoteId = engineer.url().split('/').pop() ?? '';
    await islandsReady(engineer);
    const number = ((await engineer.getByRole('heading', { level: 1 }).textContent()) ?? '').replace('Quote ', '').trim();
    await engineer.getByRole('button', { name: `Send to ${rail.email}…` }).click();
    await engineer.getByRole('button', { name: `Send quote ${number}` }).click();
    await engineer.waitForURL(/\?sent=1$/);

    // The client asks a question from the quote; the engineer answers on the review page.
    await client.goto(`${baseUrl}/quotes/${quoteId}`);
    await client.getByRole('link', { name: 'Ask a question' }).click();
    await islandsReady(client);
    await client.getByLabel('Write to the consultancy').fill('Does the bench test cover the 40 V case?');
    await client.getByRole('button', { name: 'Send message' }).click();
    await client.getByRole('list', { name: 'Messages, oldest first' }).getByText('cover the 40 V case?').waitFor();
    await engineer.goto(`${baseUrl}/desk/briefs/${rail.briefId}#messages`);
    await engineer.getByLabel('Write to the client').scrollIntoViewIfNeeded();
    await islandsReady(engineer);
    await engineer.getByLabel('Write to the client').fill('Yes: 18 V, 24 V and 40 V, each at full load.');
    await engineer.getByRole('button', { name: 'Send message' }).click();
    await engineer.getByRole('list', { name: 'Messages, oldest first' }).getByText('each at full load').waitFor();

    // The client reads the answer, accepts with a PO number and pays the deposit.
    await client.reload();
    await client.getByRole('list', { name: 'Messages, oldest first' }).getByText('each at full load').waitFor();
    await client.goto(`${baseUrl}/quotes/${quoteId}`);
    await client.getByRole('link', { name: 'Accept…' }).click();
    await client.getByLabel('Your purchase-order number (optional)').fill('PO-88410');
    await client.getByRole('button', { name: `Accept quote ${number}` }).click();
    await client.getByRole('button', { name: 'Pay the deposit' }).click();
    await payWithTestCard(client);
    await client.getByText(/Deposit received/).waitFor({ timeout: 20_000 });

    // The engineer designs and delivers: the invoice goes out with the move.
    await moveBrief(engineer, rail.briefId, 'in-design');
    await moveBrief(engineer, rail.briefId, 'delivered', 'Design pack and test report sent');
    await engineer.goto(`${baseUrl}/desk/quotes/${quoteId}`);
    const staffInvoice = engineer.getByRole('region', { name: /^Invoice INV-/ });
    expect(await staffInvoice.textContent()).toContain('Balance due');

    // The client pays the balance from the quote page.
    await client.goto(`${baseUrl}/quotes/${quoteId}`);
    const invoice = client.getByRole('region', { name: /^Invoice INV-/ });
    expect(await invoice.textContent()).toContain('PO-88410');
    await client.getByRole('link', { name: /^Balance due:/ }).click();
    await screenshot(client, 'balance-client-invoice');
    expect(await client.evaluate(() => document.scrollingElement!.scrollWidth)).toBeLessThanOrEqual(390);
    await invoice.getByRole('button', { name: 'Pay the balance' }).click();
    await payWithTestCard(client);
    await client.waitForURL(new RegExp(`/quotes/${quoteId}\\?balance=returned`));
    // The page refreshes itself until the signed webhook has been applied.
    await client.getByText(/Balance received/).waitFor({ timeout: 20_000 });
    expect(await invoice.textContent()).toContain('Paid on');
    await screenshot(client, 'balance-client-paid');
    await client.goto(`${baseUrl}/briefs/${rail.briefId}`);
    expect(await client.locator('h1 + span').textContent()).toContain('Paid in full');
    expect(await client.getByText(/Invoice INV-\d{4}-\d{4}: balance paid on .*, paid in full/).count()).toBe(1);

    // Both receipts reached the client, each once, the balance's with the PO.
    const subjects = (await mailsTo(mailApiUrl, rail.email)).map((m) => m.subject);
    expect(subjects.filter((s) => s.startsWith('Receipt: deposit of'))).toHaveLength(1);
    expect(subjects.filter((s) => s.startsWith('Receipt: balance of'))).toHaveLength(1);
    expect(subjects.filter((s) => s.startsWith('Invoice INV-'))).toHaveLength(1);
    const receipt = (await mailsTo(mailApiUrl, rail.email)).find((m) => m.subject.startsWith('Receipt: balance of'));
    expect((await (await fetch(`${mailApiUrl}/messages/${receipt?.id}`)).json()).text).toContain('PO-88410');
    await phone.close();
    await desk.close();
    expect(errors).toEqual([]);
  });
});
