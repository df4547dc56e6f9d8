/**
 * The client's and the engineer's week around a brief, in the browser at a desk and on a phone:
 * files sent with a message, the header's unread count, deleting a draft, withdrawing a brief,
 * a change-request link opened signed out, and the wizard storing nothing until typed in.
 */
import { fileURLToPath } from 'node:url';
import type { Browser, Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { islandsReady, screenshot, signInThroughForm, useBrowser } from './browser';
import { DEMO } from '../support/client';
import { CLIENT_PASSWORD, railUnderReview, RAIL_SPEC } from '../integration/quotes/helpers';

const baseUrl = inject('baseUrl');
const browser = useBrowser();
const SIZES = [
  { name: 'desk', viewport: { width: 1366, height: 900 } },
  { name: 'phone', viewport: { width: 390, height: 844 } },
] as const;
const DATASHEET = fileURLToPath(new URL('../fixtures/uploads/datasheet.pdf', import.meta.url));

async function signedInPage(b: Browser, viewport: { width: number; height: number }, email: string, password?: string) {
  const context = await b.newContext({ viewport });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughForm(page, baseUrl, email, password);
  return { context, page, errors };
}

/** The page never scrolls sideways, at either width. */
const noSidewaysScroll = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);

describe('files with a message and the unread count', () => {
  test('the client sends a file from a phone; the engineer sees the count, opens the brief, downloads it; the count is gone', async () => {
    const rail = await railUnderReview(baseUrl);
    const client = await signedInPage(browser(), SIZES[1].viewport, rail.email, CLIENT_PASSWORD);
    await client.page.goto(`${baseUrl}/briefs/${rail.briefId}#messages`);
    await islandsReady(client.page);
    await client.page.getByLabel('Write to the consultancy').fill('The bus sag we measured is in the attached sheet.');
    await client.page.setInputFiles('#message-files', DATASHEET);
    await client.page.getByRole('list', { name: 'Files to send with this message' }).getByText('datasheet.pdf').waitFor();
    await client.page.getByRole('button', { name: 'Send message' }).click();
    const sent = client.page.getByRole('list', { name: 'Attached files' }).getByRole('link', { name: 'datasheet.pdf' });
    await sent.waitFor();
    expect(await noSidewaysScroll(client.page)).toBe(true);
    await screenshot(client.page, 'relationship-attachment-phone');

    const engineer = await signedInPage(browser(), SIZES[0].viewport, DEMO.engineer);
    await engineer.page.goto(`${baseUrl}/desk`);
    const count = engineer.page.locator('[data-unread]');
    await count.waitFor();
    expect(await count.textContent()).toMatch(/\d+ unread messages?/);
    const before = Number(await count.getAttribute('data-unread'));
    await screenshot(engineer.page, 'relationship-unread-desk');
    await engineer.page.goto(`${baseUrl}/desk/briefs/${rail.briefId}#messages`);
    const link = engineer.page.getByRole('list', { name: 'Attached files' }).getByRole('link', { name: 'datasheet.pdf' });
    await link.scrollIntoViewIfNeeded();
    const download = engineer.page.waitForEvent('download');
    await link.click();
    expect((await download).suggestedFilename()).toBe('datasheet.pdf');
    await screenshot(engineer.page, 'relationship-attachment-review');
    // Reading the brief took its message off the count.
    const after = Number(
      (await engineer.page
        .locator('[data-unread]')
        .getAttribute('data-unread', { timeout: 1_000 })
        .catch(() => '0')) ?? 0,
    );
    expect(after).toBe(before - 1);

    // The engineer answers; the client's header says so in words, on the phone too.
    await islandsReady(engineer.page);
    await engineer.page.getByLabel('Write to the client').fill('Thank you: the sag fits the buck’s input range.');
    await engineer.page.getByRole('button', { name: 'Send message' }).click();
    await engineer.page.getByText('fits the buck’s input range').waitFor();
    await client.page.goto(`${baseUrl}/briefs`);
    await client.page.getByRole('link', { name: '1 unread message' }).waitFor();
    expect(await noSidewaysScroll(client.page)).toBe(true);
    await screenshot(client.page, 'relationship-unread-phone');
    await client.page.getByRole('link', { name: '1 unread message' }).click();
    await client.page.getByText('fits the buck’s input range').waitFor();
    expect(await client.page.locator('[data-unread]').count()).toBe(0);

    await engineer.context.close();
    await client.context.close();
    expect([...client.errors, ...engineer.errors]).toEqual([]);
  });
});

describe.each(SIZES)('the client’s own briefs at $viewport.width px', ({ name, viewport }) => {
  test('deleting a draft takes a confirming step; withdrawing a submitted brief takes a tick', async () => {
    const rail = await railUnderReview(baseUrl);
    const draft = await (
      await rail.client.request('/api/v1/briefs', { method: 'POST', json: { title: `Bench supply draft ${name}` } })
    ).json();
    const submitted = await (
      await rail.client.request('/api/v1/briefs', {
        method: 'POST',
        json: { title: `Sensor rail to withdraw ${name}`, spec: RAIL_SPEC, submit: true },
      })
    ).json();
    const client = await signedInPage(browser(), viewport, rail.email, CLIENT_PASSWORD);
    const { page } = client;

    await page.goto(`${baseUrl}/briefs`);
    const item = page.getByRole('listitem').filter({ hasText: `Bench supply draft ${name}` });
    await item.getByText('Delete this draft…').click();
    await screenshot(page, `relationship-delete-draft-${name}`);
    await item.getByRole('button', { name: 'Yes, delete the draft' }).click();
    await page.getByRole('status').getByText('The draft is deleted.').waitFor();
    expect(await page.getByText(`Bench supply draft ${name}`).count()).toBe(0);
    expect((await rail.client.request(`/api/v1/briefs/${draft.id}`)).status).toBe(404);

    await page.goto(`${baseUrl}/briefs/${submitted.id}`);
    await page.getByText('Withdraw this brief…').click();
    await page.getByLabel(/Yes, withdraw/).check();
    expect(await noSidewaysScroll(page)).toBe(true);
    await screenshot(page, `relationship-withdraw-${name}`);
    await page.getByRole('button', { name: 'Withdraw the brief' }).click();
    await page.getByRole('status').getByText('Your brief is withdrawn').waitFor();
    await page.getByRole('heading', { level: 1 }).locator('xpath=..').getByText('Cancelled').waitFor();
    expect((await (await rail.client.request(`/api/v1/briefs/${submitted.id}`)).json()).state).toBe('cancelled');
    await client.context.close();
    expect(client.errors).toEqual([]);
  });

  test('a change-request link opened signed out asks for sign-in and comes back to the brief with the request', async () => {
    const rail = await railUnderReview(baseUrl);
    const request = 'Please give the connector’s rating and the cable length.';
    const moved = await rail.engineer.request(`/api/v1/briefs/${rail.briefId}`, {
      method: 'PATCH',
      json: { state: 'changes-requested', note: request },
    });
    expect(moved.status).toBe(200);
    const context = await browser().newContext({ viewport });
    const page = await context.newPage();
    await page.goto(`${baseUrl}/briefs/new?draft=${rail.briefId}`);
    await page.waitForURL(/\/sign-in\?next=/);
    await page.getByLabel('E-mail').fill(rail.email);
    await page.getByLabel('Password').fill(CLIENT_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(new RegExp(`/briefs/new\\?draft=${rail.briefId}$`));
    await page.getByRole('heading', { name: /asked for changes/ }).waitFor();
    await page.getByText(request).waitFor();
    await islandsReady(page);
    await page.getByText('The consultancy asked for changes (their message is above)').waitFor();
    expect(await page.getByText('Draft restored.').count()).toBe(0);
    await screenshot(page, `relationship-change-link-${name}`);
    await context.close();
  });
});

describe('the wizard stores nothing until the client types', () => {
  test('opening /briefs/new and leaving creates no draft; the first answer creates one', async () => {
    const rail = await railUnderReview(baseUrl);
    const total = async () => (await (await rail.client.request('/api/v1/briefs?pageSize=100')).json()).total as number;
    const before = await total();
    const client = await signedInPage(browser(), SIZES[0].viewport, rail.email, CLIENT_PASSWORD);
    await client.page.goto(`${baseUrl}/briefs/new`);
    await islandsReady(client.page);
    // Longer than the autosave's pause.
    await client.page.waitForTimeout(2_500);
    await client.page.goto(`${baseUrl}/briefs`);
    expect(await total()).toBe(before);

    await client.page.goto(`${baseUrl}/briefs/new`);
    await islandsReady(client.page);
    await client.page.getByLabel('What feeds the rail?').selectOption('bus');
    await client.page.getByText(/Draft saved/).waitFor();
    expect(await total()).toBe(before + 1);
    await client.context.close();
    expect(client.errors).toEqual([]);
  });
});

describe.each(SIZES)('a declined quote on the desk at $viewport.width px', ({ name, viewport }) => {
  test('the engineer reads the client’s reason on the quote page and the review', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    const reason = 'Over our budget for this batch; a cheaper linear would do.';
    expect((await rail.client.request(`/api/v1/quotes/${quote.id}/decline`, { method: 'POST', json: { reason } })).status).toBe(200);

    const engineer = await signedInPage(browser(), viewport, DEMO.engineer);
    await engineer.page.goto(`${baseUrl}/desk/quotes/${quote.id}`);
    // The reason stands in its own box (the quote's history below repeats it).
    await engineer.page.getByRole('region', { name: 'Declined by the client' }).getByText(`“${reason}”`).waitFor();
    expect(await noSidewaysScroll(engineer.page)).toBe(true);
    await screenshot(engineer.page, `relationship-declined-quote-${name}`);
    await engineer.page.goto(`${baseUrl}/desk/briefs/${rail.briefId}`);
    const declined = engineer.page.getByRole('region', { name: 'Declined quotes' });
    await declined.getByText(`“${reason}”`).waitFor();
    await declined.scrollIntoViewIfNeeded();
    await engineer.context.close();
    expect(engineer.errors).toEqual([]);
  });
});
