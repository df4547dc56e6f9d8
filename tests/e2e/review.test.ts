import { readFile } from 'node:fs/promises';
import { gzipSync } from 'node:zlib';
import { describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { islandsReady, useBrowser, screenshot, signInThroughForm } from './browser';
import { DEMO } from '../support/client';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

const LAPTOP = { width: 1440, height: 900 };

/** The options in the order the page shows them, best first. */
/** Each card's topology and score, best first: a re-run with new weights changes the scores even where the order stays. */
async function standing(page: Page): Promise<string[]> {
  return page
    .getByRole('list', { name: 'Options, best first' })
    .locator('article[data-topology]')
    .evaluateAll((cards) =>
      cards.map((c) => `${c.getAttribute('data-topology') ?? ''} ${c.querySelector('[data-figure="score"] dd')?.textContent ?? ''}`),
    );
}

async function chartsDrawn(page: Page): Promise<void> {
  // uPlot is loaded on demand; three canvases appear once it has drawn.
  await expect.poll(() => page.locator('figure canvas').count(), { timeout: 15_000 }).toBeGreaterThanOrEqual(3);
}

/** Gzipped size of every script the page loads, dynamic imports included, in KB. */
async function scriptKb(page: Page, load: () => Promise<void>): Promise<number> {
  const urls = new Set<string>();
  page.on('request', (request) => {
    if (request.resourceType() === 'script') urls.add(request.url());
  });
  await load();
  // Fetched again after the page settled: a navigation may drop the browser's copy of a body.
  const bodies = await Promise.all([...urls].map(async (url) => (await page.request.get(url)).body()));
  return bodies.reduce((sum, body) => sum + gzipSync(body).length, 0) / 1024;
}

describe('an engineer reviews a brief', () => {
  test('opens the submitted high-voltage brief from the desk, re-weights and overrides, saves two revisions, compares them and downloads the netlist', async () => {
    const context = await browser().newContext({ viewport: LAPTOP, acceptDownloads: true });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));

    await signInThroughForm(page, baseUrl, DEMO.engineer);
    await page.goto(`${baseUrl}/desk`);
    await islandsReady(page);
    await page.getByLabel('State').selectOption('submitted');
    const row = page.getByRole('link', { name: 'Detector bias, 150 V from a 300–350 V supply' });
    await row.waitFor();
    await expect.poll(() => page.locator('tbody tr').filter({ hasNotText: 'Submitted' }).count()).toBe(0);
    await page.getByLabel('Search').fill('Aster');
    await expect.poll(() => page.locator('tbody tr').count()).toBe(1);
    await expect.poll(() => page.url()).toContain('q=Aster');
    await page.getByText('Hazardous voltage: 350 V').waitFor();
    await page.getByRole('button', { name: /Title/ }).click();
    await expect.poll(() => page.url()).toContain('sort=title');
    await screenshot(page, 'desk-submitted');
    await row.click();

    await page.getByRole('heading', { name: 'Detector bias, 150 V from a 300–350 V supply', level: 1 }).waitFor();
    await islandsReady(page);
    const cautions = page.getByRole('note', { name: /Cautions/ }).first();
    await expect.poll(() => cautions.textContent()).toContain('above the 60 V ES1 limit');
    expect(await cautions.textContent()).toContain('defer to local electrical codes and licensed practice');
    await chartsDrawn(page);
    const before = await standing(page);
    expect(before).toHaveLength(7);
    await screenshot(page, 'review-high-voltage');

    // A much heavier cost weight and a forced pass device: re-run, and the standing changes.
    await page.getByLabel('Parts cost weight').fill('10');
    await page.getByLabel('Pass device').selectOption('nmos');
    await expect.poll(() => page.getByText('Changed since the last run').count()).toBe(1);
    await page.getByRole('button', { name: 'Re-run the engine' }).click();
    await expect.poll(() => standing(page), { timeout: 10_000 }).not.toEqual(before);
    await page.getByText('The options below reflect these choices.').waitFor();

    await page.getByLabel('Choose Linear with high-voltage pre-drop').check();
    await page.getByLabel('Note for the record').fill('Pre-drop on an N-MOSFET; parts cost weighs most for this lab.');
    await page.getByRole('button', { name: 'Save revision' }).click();
    await page.getByText(/Revision 1 saved: Linear with high-voltage pre-drop/).waitFor();

    await page.getByLabel('Standoff voltage').fill('15');
    await page.getByRole('button', { name: 'Re-run the engine' }).click();
    await page.getByText('The options below reflect these choices.').waitFor();
    await page.getByLabel('Note for the record').fill('Higher standoff for more regulator headroom.');
    await page.getByRole('button', { name: 'Save revision' }).click();
    await page.getByText(/Revision 2 saved/).waitFor();
    await expect.poll(() => page.locator('[data-revision]').count()).toBe(2);
    await screenshot(page, 'review-high-voltage-saved');

    // Starting again from revision 1 brings back its choices: standoff empty, N-MOSFET kept.
    await page
      .locator('[data-revision="1"]')
      .getByRole('link', { name: /Start from its choices/ })
      .click();
    await page.getByText('Choices of revision 1.', { exact: false }).waitFor();
    expect(await page.getByLabel('Standoff voltage').inputValue()).toBe('');
    expect(await page.getByLabel('Pass device').inputValue()).toBe('nmos');
    expect(await page.getByLabel('Parts cost weight').inputValue()).toBe('10');

    await page.getByLabel('Compare', { exact: true }).selectOption({ label: 'Revision 1' });
    await page.getByLabel('with', { exact: true }).selectOption({ label: 'Revision 2' });
    await page.getByRole('button', { name: 'Compare side by side' }).click();
    await page.getByRole('heading', { name: 'Compare revisions' }).waitFor();
    const inputs = page.locator('table[data-compare="inputs"]');
    expect(await inputs.textContent()).toContain('Standoff voltage');
    expect(await inputs.textContent()).not.toContain('Parts cost weight');
    await screenshot(page, 'review-compare');

    await page.getByRole('link', { name: 'Calculation sheet 2' }).click();
    await page.getByRole('heading', { name: 'Calculation', exact: true }).waitFor();
    await screenshot(page, 'review-sheet');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download SPICE netlist (.cir)' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('detector-bias-150-v-from-a-300-350-v-supply-rev2.cir');
    const netlist = await readFile((await download.path())!, 'utf8');
    expect(netlist).toContain('NMOS');
    expect(netlist).toContain('* CAUTION: This supply works at up to 350 V DC');
    expect(netlist.trimEnd().endsWith('.end')).toBe(true);

    expect(errors).toEqual([]);
    await context.close();
  });

  test('reads the quiet low-voltage brief: spread against its tight band, part list and calculation trace', async () => {
    const context = await browser().newContext({ viewport: LAPTOP });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(page, baseUrl, DEMO.engineer);
    await page.goto(`${baseUrl}/desk?q=Bench`);
    await page.getByRole('link', { name: 'Bench meter analog front-end, quiet 12 V' }).click();
    await page.getByRole('heading', { name: 'Ways to build it, best first' }).waitFor();
    await islandsReady(page);
    await chartsDrawn(page);
    const spread = page.getByRole('figure', { name: /Output-voltage spread/ });
    expect(await spread.textContent()).toMatch(/within the tolerance band/);
    const trace = page.locator('[data-trace]');
    expect(await trace.count()).toBeGreaterThan(5);
    expect(await page.getByRole('table', { name: /Part list/ }).textContent()).toContain(
      'typical — confirm against the chosen part’s data',
    );
    await screenshot(page, 'review-quiet');

    // Keyboard: the weight fields are reachable and a typed value re-runs on Enter.
    await page.getByLabel('Quietness weight').focus();
    await page.keyboard.press('Control+A');
    await page.keyboard.type('9');
    await page.keyboard.press('Enter');
    await page.getByText('The options below reflect these choices.').waitFor();
    expect(errors).toEqual([]);
    await context.close();
  });

  test('on a phone the review fits the screen and wakes when scrolled to', async () => {
    const context = await browser().newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(page, baseUrl, DEMO.engineer);
    await page.goto(`${baseUrl}/desk?q=Aster`);
    await page.getByRole('link', { name: 'Detector bias, 150 V from a 300–350 V supply' }).click();
    await page.getByRole('heading', { name: 'Ways to build it, best first' }).waitFor();
    // Long equations and figure lists wrap instead of widening the page.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.getByRole('heading', { name: 'Ways to build it, best first' }).scrollIntoViewIfNeeded();
    await islandsReady(page);
    await chartsDrawn(page);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await screenshot(page, 'review-phone');
    expect(errors).toEqual([]);
    await context.close();
  });

  test('the desk and the review each ship under 120 KB of gzipped JavaScript, the chart library included', async () => {
    const context = await browser().newContext({ viewport: LAPTOP });
    const page = await context.newPage();
    await signInThroughForm(page, baseUrl, DEMO.engineer);
    const desk = await scriptKb(page, async () => {
      await page.goto(`${baseUrl}/desk?q=Detector`, { waitUntil: 'networkidle' });
    });
    const href = await page.getByRole('link', { name: /Detector bias/ }).getAttribute('href');
    const reviewPage = await context.newPage();
    const review = await scriptKb(reviewPage, async () => {
      await reviewPage.goto(`${baseUrl}${href}`, { waitUntil: 'networkidle' });
      await chartsDrawn(reviewPage);
    });
    expect(desk).toBeGreaterThan(60);
    expect(desk).toBeLessThan(120);
    expect(review).toBeGreaterThan(desk);
    expect(review).toBeLessThan(120);
    await context.close();
  });
});
