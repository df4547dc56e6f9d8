import { readFile } from 'node:fs/promises';
import { gzipSync } from 'node:zlib';
import { describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { chooseWeight, islandsReady, useBrowser, screenshot, signInThroughForm, weightStep } from './browser';
import { DEMO } from '../support/client';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

const LAPTOP = { width: 1440, height: 900 };

/** Each column's topology and score, in the order the matrix shows them: a re-run with new weights changes the scores even where the order stays. */
async function standing(page: Page): Promise<string[]> {
  return page.locator('table[data-ranking-matrix]').evaluate((table) => {
    const scores = [...table.querySelectorAll('tr[data-row="score"] td')].map((td) => td.textContent ?? '');
    return [...table.querySelectorAll('thead th[data-column]')].map(
      (th, k) => `${th.getAttribute('data-column') ?? ''} ${scores[k] ?? ''}`,
    );
  });
}

/** One quality's step in the "what matters most" control. */
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
    // Declining asks for a second, deliberate tick, shown only once Declined is chosen.
    const confirmDecline = page.getByText('Yes, decline this brief.');
    expect(await confirmDecline.isVisible()).toBe(false);
    await page.getByLabel('Move this brief to').selectOption('declined');
    await confirmDecline.waitFor();
    await page.getByLabel('Move this brief to').selectOption('in-review');
    expect(await confirmDecline.isVisible()).toBe(false);
    await islandsReady(page);
    const cautions = page.getByRole('note', { name: /Cautions/ }).first();
    await expect.poll(() => cautions.textContent()).toContain('above the 60 V ES1 limit');
    expect(await cautions.textContent()).toContain('defer to local electrical codes and licensed practice');
    await chartsDrawn(page);
    const before = await standing(page);
    expect(before).toHaveLength(7);
    // The pick stands first and marked; the ways that cannot be built carry no score and say what stops them.
    const pick = page.locator('thead th[data-column]').first();
    expect(await pick.textContent()).toContain('Our pick');
    expect(await page.locator('thead th[data-column]', { hasText: 'Our pick' }).count()).toBe(1);
    const blocked = page.locator('td[data-standing="blocked"]');
    expect(await blocked.count()).toBeGreaterThan(0);
    for (const column of await page.locator('td[data-reasons]').all()) {
      const topology = await column.getAttribute('data-reasons');
      const index = await page.locator(`thead th[data-column="${topology}"]`).evaluate((th) => (th as HTMLTableCellElement).cellIndex - 1);
      const state = await page.locator('tr[data-row="meets"] td').nth(index).getAttribute('data-standing');
      const score = await page.locator('tr[data-row="score"] td').nth(index).textContent();
      if (state === 'blocked') {
        expect(score).toContain('Not scored');
        expect(await column.textContent()).toMatch(/✕ \S/);
      } else expect(score).toMatch(/\d+\.\d/);
    }
    // The weights say their real scale in words, not 0–100.
    const weights = page.getByRole('group', { name: 'What matters most for this rail' });
    expect(await weights.textContent()).toContain('ignore = 0, a little = 1, matters = 2, matters most = 3');
    expect(await weights.textContent()).not.toContain('0–100');
    expect(await weightStep(page, 'Efficiency', 'Matters most').isChecked()).toBe(true);
    await screenshot(page, 'review-high-voltage');

    // Cost counts most, efficiency not at all, and a forced pass device: re-run, and the standing changes.
    await chooseWeight(page, 'Parts cost', 'Matters most');
    await chooseWeight(page, 'Efficiency', 'Ignore');
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
    expect(await weightStep(page, 'Parts cost', 'Matters most').isChecked()).toBe(true);
    expect(await weightStep(page, 'Efficiency', 'Ignore').isChecked()).toBe(true);

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
    await page.getByRole('heading', { name: 'Ways to build it, side by side' }).waitFor();
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

    // Keyboard: a quality's steps are one stop, the arrows move between them, and the run button re-ranks.
    await weightStep(page, 'Quietness', 'Matters').focus();
    await page.keyboard.press('ArrowRight');
    expect(await weightStep(page, 'Quietness', 'Matters most').isChecked()).toBe(true);
    await page.getByRole('button', { name: 'Re-run the engine' }).press('Enter');
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
    await page.getByRole('heading', { name: 'Ways to build it, side by side' }).waitFor();
    // Long equations and figure lists wrap instead of widening the page.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.getByRole('heading', { name: 'Ways to build it, side by side' }).scrollIntoViewIfNeeded();
    await islandsReady(page);
    await chartsDrawn(page);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    // The matrix scrolls sideways inside its own box, its first column staying in view.
    const matrix = page.getByRole('region', { name: 'Ways compared, scrolls sideways' });
    const box = await matrix.evaluate((el) => ({ scroll: el.scrollWidth, client: el.clientWidth }));
    expect(box.scroll).toBeGreaterThan(box.client);
    await matrix.evaluate((el) => el.scrollBy({ left: 400 }));
    const firstColumn = await page.locator('tr[data-row="loss"] th').boundingBox();
    expect(firstColumn?.x).toBeGreaterThanOrEqual(0);
    expect(firstColumn?.x).toBeLessThan(40);
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
