// The review page's drawing at laptop and phone width: visible, linked both ways with the part
// list (and the trace), and never widening the page.
import { describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, signInThroughForm, useBrowser } from './browser';
import { DEMO } from '../support/client';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

async function openReview(page: Page): Promise<void> {
  await signInThroughForm(page, baseUrl, DEMO.engineer);
  await page.goto(`${baseUrl}/desk`);
  const review = await page.$$eval('a', (links) =>
    links.map((a) => a.getAttribute('href') ?? '').find((href) => /^\/desk\/briefs\/[^/]+$/.test(href)),
  );
  expect(review).toBeTruthy();
  await page.goto(`${baseUrl}${review}`);
  // The desk wakes when scrolled to (below the brief on a phone), and the drawing loads as it comes near.
  await page.getByRole('heading', { name: 'Schematic', exact: true }).scrollIntoViewIfNeeded();
  await page.getByTestId('schematic-chosen').scrollIntoViewIfNeeded();
  await page.waitForFunction(
    () => {
      const island = document.querySelector('[data-testid="schematic-chosen"]')?.closest('astro-island');
      return island !== null && island !== undefined && !island.hasAttribute('ssr');
    },
    undefined,
    { timeout: 30_000 },
  );
}

const noSideways = (page: Page) => page.evaluate(() => document.scrollingElement!.scrollWidth <= window.innerWidth);

describe.each([
  ['laptop', { width: 1366, height: 900 }],
  ['phone', { width: 390, height: 844 }],
])('the review drawing on a %s', (name, viewport) => {
  test('is drawn, marks a part picked in it in the part list and the trace and back, and draws a chosen thumbnail large', async () => {
    const context = await browser().newContext({ viewport });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await openReview(page);

    const drawing = page.getByTestId('schematic-chosen');
    const svg = drawing.locator('svg[role="img"]');
    await svg.scrollIntoViewIfNeeded();
    expect(await svg.isVisible()).toBe(true);
    expect((await svg.boundingBox())!.height).toBeGreaterThan(150);
    const refs = await drawing.locator('[data-ref]').evaluateAll((groups) => groups.map((g) => g.getAttribute('data-ref') ?? ''));
    expect(refs.length).toBeGreaterThan(2);
    // A part with lines of its own in the trace: the regulator or switch where there is one.
    const withTrace = await page.evaluate((all) => all.find((ref) => document.querySelector(`[data-trace^="${ref}."]`)) ?? all[0]!, refs);

    await drawing.locator(`[data-ref="${withTrace}"]`).click();
    const row = page.locator(`tr[data-ref="${withTrace}"]`);
    await expect.poll(() => row.getAttribute('data-selected')).toBe('true');
    expect(await row.getByRole('button', { name: withTrace, exact: true }).getAttribute('aria-pressed')).toBe('true');
    expect(await page.locator(`[data-trace^="${withTrace}."][data-selected]`).count()).toBeGreaterThan(0);
    expect(await drawing.locator(`[data-ref="${withTrace}"][data-selected]`).count()).toBe(1);
    // The selected symbol is drawn heavier, not only in another colour.
    const width = await drawing
      .locator(`[data-ref="${withTrace}"] path`)
      .first()
      .evaluate((p) => getComputedStyle(p).strokeWidth);
    expect(parseFloat(width)).toBeGreaterThan(3);

    const other = refs.find((r) => r !== withTrace)!;
    await page.locator(`tr[data-ref="${other}"]`).getByRole('button', { name: other, exact: true }).click();
    await expect.poll(() => drawing.locator(`[data-ref="${other}"][data-selected]`).count()).toBe(1);
    expect(await drawing.locator(`[data-ref="${withTrace}"][data-selected]`).count()).toBe(0);
    expect(await row.getAttribute('data-selected')).toBeNull();

    // Each candidate is drawn small; choosing one draws it large.
    const thumbs = page.getByRole('list', { name: 'Candidate drawings' }).getByRole('button');
    expect(await thumbs.count()).toBe(7);
    const pressed = await thumbs.evaluateAll((buttons) => buttons.map((b) => b.getAttribute('aria-pressed')));
    const candidate = thumbs.nth(pressed.indexOf('false'));
    const candidateName = (await candidate.locator('span.font-semibold').textContent())!.trim();
    expect(await candidate.locator('svg[role="img"]').count()).toBe(1);
    await candidate.click();
    await expect.poll(() => page.getByRole('heading', { name: `The chosen design: ${candidateName}` }).count()).toBe(1);
    expect(await candidate.getAttribute('aria-pressed')).toBe('true');

    expect(await noSideways(page)).toBe(true);
    await drawing.scrollIntoViewIfNeeded();
    await screenshot(page, `review-schematic-${name}`);
    expect(errors).toEqual([]);
    await context.close();
  });
});
