import { describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import path from 'node:path';
import { islandsReady, screenshot, SCREENSHOT_DIR, signInThroughForm, useBrowser } from './browser';
import { DEMO } from '../support/client';
import { CLIENT_PASSWORD, railUnderReview } from '../integration/quotes/helpers';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

const sidewaysScroll = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);

describe('the quote lists', () => {
  test('the client reaches their quotes from the header, the consultancy theirs; both filter and fit 1366 and 390 px', async () => {
    const context = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));

    await signInThroughForm(page, baseUrl, DEMO.client);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'My quotes' }).click();
    await page.waitForURL(`${baseUrl}/quotes`);
    expect(await page.locator('tr[data-quote]').count()).toBeGreaterThan(0);
    await expect.poll(() => page.locator('td[data-deposit="paid"]').count()).toBeGreaterThan(0);
    for (const width of [1366, 390]) {
      await page.setViewportSize({ width, height: 900 });
      expect(await sidewaysScroll(page), `client list at ${width} px`).toBeLessThanOrEqual(0);
      await screenshot(page, `quotes-client-${width}`);
    }
    // At 390 px each quote stacks its figures under their labels.
    expect(await page.locator('tr[data-quote]').first().getByText('Balance', { exact: true }).isVisible()).toBe(true);
    await page.getByLabel('State').selectOption('deposit-paid');
    await page.getByRole('button', { name: 'Show' }).click();
    await page.waitForURL(/state=deposit-paid/);
    const states = await page.locator('tr[data-quote]').evaluateAll((rows) => rows.map((r) => r.textContent ?? ''));
    expect(states.length).toBeGreaterThan(0);
    for (const row of states) expect(row).toContain('Deposit paid');

    // More quotes than a page of ten holds, whatever else the test stack has made.
    for (let k = 0; k < 11; k += 1) {
      const rail = await railUnderReview(baseUrl);
      const drafted = await rail.engineer.request('/api/v1/quotes', {
        method: 'POST',
        json: { revisionId: rail.revisionId, infeasibleReason: 'Paging fixture' },
      });
      expect(drafted.status).toBe(201);
    }
    await context.clearCookies();
    await page.setViewportSize({ width: 1366, height: 900 });
    await signInThroughForm(page, baseUrl, DEMO.engineer);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Quotes' }).click();
    await page.waitForURL(`${baseUrl}/desk/quotes`);
    expect(await page.getByRole('columnheader', { name: 'Client' }).isVisible()).toBe(true);
    for (const width of [1366, 390]) {
      await page.setViewportSize({ width, height: 900 });
      expect(await sidewaysScroll(page), `consultancy list at ${width} px`).toBeLessThanOrEqual(0);
      await screenshot(page, `quotes-desk-${width}`);
    }
    await page.setViewportSize({ width: 1366, height: 900 });
    await page.getByLabel('Rows per page').selectOption('10');
    await page.getByRole('button', { name: 'Show' }).click();
    await page.waitForURL(/pageSize=10/);
    const count = (await page.getByTestId('quote-count').textContent()) ?? '';
    expect(Number(/of (\d+) quote/.exec(count)?.[1])).toBeGreaterThan(10);
    await page.getByRole('link', { name: 'Next →' }).click();
    await page.waitForURL(/page=2/);
    expect(await page.getByTestId('quote-count').textContent()).toContain(`11–`);
    expect(errors).toEqual([]);
    await context.close();
  });
});

describe('from the review to a quote', () => {
  test('the review links to drafting; the newest feasible revision is offered; an infeasible one asks for a reason', async () => {
    const rail = await railUnderReview(baseUrl);
    // A boost cannot step 24 V down to 12 V: the newest revision is not feasible.
    const saved = await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`, {
      method: 'POST',
      json: { topology: 'boost', note: 'For comparison' },
    });
    expect(saved.status).toBe(201);
    const context = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    await signInThroughForm(page, baseUrl, DEMO.engineer);
    await page.goto(`${baseUrl}/desk/briefs/${rail.briefId}`);
    await islandsReady(page);
    const revisions = page.getByRole('list', { name: 'Saved revisions, newest first' });
    // In words and a mark, not colour alone.
    expect(await revisions.locator('[data-revision="2"] [data-feasible]').textContent()).toBe('✕ Not feasible');
    expect(await revisions.locator('[data-revision="1"] [data-feasible]').textContent()).toBe('✓ Feasible');

    // The compare page says the same of both sides.
    await page.getByRole('button', { name: 'Compare side by side' }).click();
    await page.waitForURL(/\/compare\?/);
    expect((await page.locator('td[data-feasible]').allTextContents()).map((t) => t.trim())).toEqual(['✓ Feasible', '✕ Not feasible']);
    for (const width of [1366, 390]) {
      await page.setViewportSize({ width, height: 900 });
      expect(await sidewaysScroll(page), `compare at ${width} px`).toBeLessThanOrEqual(0);
      await screenshot(page, `revision-compare-${width}`);
    }
    await page.setViewportSize({ width: 1366, height: 900 });
    await page.goBack();
    await islandsReady(page);
    await revisions.scrollIntoViewIfNeeded();
    await revisions.screenshot({ path: path.join(SCREENSHOT_DIR, 'review-revisions-1366.png') });
    await page.getByTestId('draft-quote').click();
    await page.waitForURL(/\/desk\/quotes\/new\?briefId=/);
    // The newest feasible revision is chosen, and no reason is asked for it.
    expect(await page.getByRole('radio', { name: /^Revision 1/ }).isChecked()).toBe(true);
    const reason = page.getByLabel('Why quote a design that does not meet the brief?');
    expect(await reason.isVisible()).toBe(false);
    await page.getByRole('radio', { name: /^Revision 2/ }).check();
    expect(await reason.isVisible()).toBe(true);
    for (const width of [1366, 390]) {
      await page.setViewportSize({ width, height: 900 });
      expect(await sidewaysScroll(page), `draft form at ${width} px`).toBeLessThanOrEqual(0);
      await screenshot(page, `quote-draft-infeasible-${width}`);
    }
    await page.setViewportSize({ width: 1366, height: 900 });
    await page.getByRole('button', { name: 'Draft the quote' }).click();
    expect(await page.getByText('Say why it is quoted all the same').isVisible()).toBe(true);
    await reason.fill('Shown to the client beside the buck for a decision on cost.');
    await page.getByRole('button', { name: 'Draft the quote' }).click();
    await page.waitForURL(/\/desk\/quotes\/[0-9a-f-]{36}$/);
    await islandsReady(page);
    expect(await page.getByTestId('infeasible-reason').textContent()).toContain('beside the buck for a decision on cost');

    // The builder's note to the client, saved with the draft.
    await page.getByLabel('Note to the client').fill('Both options are priced; we recommend the buck.');
    await page.getByRole('button', { name: 'Save draft' }).click();
    await page.getByText('Saved. The totals below are the stored ones.').waitFor();
    for (const width of [1366, 390]) {
      await page.setViewportSize({ width, height: 900 });
      expect(await sidewaysScroll(page), `quote builder at ${width} px`).toBeLessThanOrEqual(0);
      await screenshot(page, `quote-builder-notes-${width}`);
    }
    await page.reload();
    expect(await page.getByLabel('Note to the client').inputValue()).toBe('Both options are priced; we recommend the buck.');
    const quoteId = new URL(page.url()).pathname.split('/').at(-1);
    await context.close();

    // The client reads the note, and neither the revision's note nor the reason.
    expect((await rail.engineer.request(`/api/v1/quotes/${quoteId}/send`, { method: 'POST' })).status).toBe(200);
    const clientContext = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const client = await clientContext.newPage();
    await signInThroughForm(client, baseUrl, rail.email, CLIENT_PASSWORD);
    await client.goto(`${baseUrl}/quotes/${quoteId}`);
    expect(await client.getByTestId('client-note').textContent()).toContain('we recommend the buck');
    const text = (await client.locator('main').textContent()) ?? '';
    expect(text).not.toContain('For comparison');
    expect(text).not.toContain('decision on cost');
    for (const width of [1366, 390]) {
      await client.setViewportSize({ width, height: 900 });
      expect(await sidewaysScroll(client), `client quote page at ${width} px`).toBeLessThanOrEqual(0);
      await screenshot(client, `quote-client-note-${width}`);
    }
    await clientContext.close();
  });
});
