import { describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { chooseWeight, islandsReady, screenshot, signInThroughForm, useBrowser, weightStep } from './browser';
import { DEMO } from '../support/client';
import { railUnderReview, type QuotedRail } from '../integration/quotes/helpers';
import { TOPOLOGY_NAMES } from '../../src/lib/review/option-words';
import type { TopologyId } from '../../src/lib/engine/types';

const baseUrl = inject('baseUrl');
const browser = useBrowser();
const LAPTOP = { width: 1366, height: 900 };
const PHONE = { width: 390, height: 844 };

/** A ripple limit no option can meet: every design of the rail is blocked. */
const IMPOSSIBLE = { requirement: { maxRippleVpp: 1e-9 } };

interface SavedRevision {
  id: string;
  number: number;
  topology: string;
  result: { options: { topology: string; issues: { severity: string; message: string }[] }[] };
}

async function saveRevision(rail: QuotedRail, body: object): Promise<SavedRevision> {
  const saved = await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`, { method: 'POST', json: body });
  expect(saved.status).toBe(201);
  return saved.json();
}

async function quoteAccepted(rail: QuotedRail): Promise<string> {
  const drafted = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } });
  expect(drafted.status).toBe(201);
  const quote = (await drafted.json()) as { id: string; number: string };
  expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
  expect((await rail.client.request(`/api/v1/quotes/${quote.id}/accept`, { method: 'POST' })).status).toBe(200);
  return quote.number;
}

async function engineerPage(viewport = LAPTOP): Promise<Page> {
  const page = await (await browser().newContext({ viewport })).newPage();
  await signInThroughForm(page, baseUrl, DEMO.engineer);
  return page;
}

/** The review island wakes when scrolled to (it sits below the brief on a phone). */
async function openReview(page: Page, path: string): Promise<void> {
  await page.goto(`${baseUrl}${path}`);
  await page.locator('#adjust-heading').scrollIntoViewIfNeeded();
  await islandsReady(page);
}

describe('the review and the desk follow the current design', () => {
  test('after a quote is accepted the review opens on its revision, says so, and links to the newer blocked one and back', async () => {
    const rail = await railUnderReview(baseUrl);
    const number = await quoteAccepted(rail);
    const newer = await saveRevision(rail, { ...IMPOSSIBLE, topology: 'linear', note: 'Tighter ripple, to discuss' });
    const listed = await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`);
    const first = ((await listed.json()) as { items: { number: number; topology: TopologyId }[] }).items.find((r) => r.number === 1)!;
    expect(first.topology).not.toBe('linear');
    const page = await engineerPage();

    await openReview(page, `/desk/briefs/${rail.briefId}`);
    const opened = page.locator('[data-opened-on]');
    await expect.poll(() => opened.textContent()).toContain(`Showing revision 1, which the accepted quote ${number} was built from.`);
    expect(await opened.textContent()).toContain(`Revision ${newer.number} is newer`);
    // The chosen design is the quoted one, not the newer blocked linear one.
    expect(await page.locator('#chosen-heading').textContent()).toContain(TOPOLOGY_NAMES[first.topology]);
    expect(await page.getByText('Choices of revision 1.').count()).toBe(1);
    await screenshot(page, 'review-opened-on-quoted-1366');

    await opened.getByRole('link', { name: `open revision ${newer.number}` }).click();
    await page.waitForURL(/from=/);
    await expect
      .poll(() => page.locator('[data-opened-on]').textContent())
      .toContain(`Showing revision ${newer.number}. The accepted quote ${number} was built from revision 1`);
    await page.getByRole('link', { name: 'open revision 1' }).click();
    await expect.poll(() => page.locator('[data-opened-on]').getAttribute('data-opened-on')).toBe('1');

    await page.setViewportSize(PHONE);
    await page.reload();
    await screenshot(page, 'review-opened-on-quoted-390');
    await page.context().close();
  });

  test('the desk shows the quoted revision’s figures, and for a brief whose newest design is blocked says no design meets it and why', async () => {
    const quoted = await railUnderReview(baseUrl);
    await quoteAccepted(quoted);
    await saveRevision(quoted, { ...IMPOSSIBLE, note: 'Newer, blocked' });
    const blocked = await railUnderReview(baseUrl);
    const stuck = await saveRevision(blocked, { ...IMPOSSIBLE, note: 'Client wants it quieter' });
    const chosen = stuck.result.options.find((o) => o.topology === stuck.topology);
    const mainReason = chosen?.issues.find((i) => i.severity === 'blocker')?.message ?? '';
    expect(mainReason).not.toBe('');
    const page = await engineerPage();

    for (const [rail, viewport] of [
      [quoted, LAPTOP],
      [blocked, PHONE],
    ] as const) {
      await page.setViewportSize(viewport);
      await page.goto(`${baseUrl}/desk?q=${encodeURIComponent(rail.name)}`);
      await islandsReady(page);
      await page.locator(`tr[data-brief="${rail.briefId}"]`).waitFor();
    }
    const row = page.locator(`tr[data-brief="${blocked.briefId}"]`);
    const design = row.locator('[data-design]');
    expect(await design.getAttribute('data-design')).toBe('blocked');
    expect(await design.textContent()).toContain('No design meets the brief');
    expect(await design.textContent()).toContain(mainReason);
    expect(await design.textContent()).toContain('Rev. 2');
    // A design that cannot be built has no efficiency or cost to compare.
    const figures = await row.locator('td.num').allTextContents();
    expect(figures.every((f) => f.trim() === '—')).toBe(true);
    await screenshot(page, 'desk-blocked-390');

    await page.setViewportSize(LAPTOP);
    await page.goto(`${baseUrl}/desk?q=${encodeURIComponent(quoted.name)}`);
    await islandsReady(page);
    const quotedRow = page.locator(`tr[data-brief="${quoted.briefId}"]`);
    expect(await quotedRow.locator('[data-design]').getAttribute('data-design')).toBe('feasible');
    expect(await quotedRow.locator('[data-design]').textContent()).toContain('Rev. 1, quoted');
    expect(await quotedRow.locator('td.num').first().textContent()).toMatch(/\d %/);
    await screenshot(page, 'desk-quoted-1366');
    await page.context().close();
  });

  test('unsaved re-run settings survive a reload until discarded', async () => {
    const rail = await railUnderReview(baseUrl);
    const page = await engineerPage();
    await openReview(page, `/desk/briefs/${rail.briefId}`);
    await page.getByLabel('Switching frequency').fill('750k');
    await chooseWeight(page, 'Efficiency', 'Ignore');
    await page.getByText('Unsaved settings.').waitFor();

    await page.reload();
    await page.locator('#adjust-heading').scrollIntoViewIfNeeded();
    await islandsReady(page);
    await expect.poll(() => page.getByLabel('Switching frequency').inputValue()).toBe('750k');
    expect(await weightStep(page, 'Efficiency', 'Ignore').isChecked()).toBe(true);
    await page.getByText('Unsaved settings from your last visit.').waitFor();
    await screenshot(page, 'review-unsaved-1366');

    await page.getByRole('button', { name: 'Discard unsaved settings' }).click();
    expect(await page.getByLabel('Switching frequency').inputValue()).toBe('');
    expect(await page.getByText('Unsaved settings').count()).toBe(0);
    await page.reload();
    await page.locator('#adjust-heading').scrollIntoViewIfNeeded();
    await islandsReady(page);
    expect(await page.getByLabel('Switching frequency').inputValue()).toBe('');
    expect(await page.getByText('Unsaved settings').count()).toBe(0);
    await page.context().close();
  });

  test('saved choices read as labelled values with units, and fill the form as SI text', async () => {
    const rail = await railUnderReview(baseUrl);
    const two = await saveRevision(rail, {
      weights: { efficiency: 0, heat: 2, partCount: 1, noise: 2, cost: 2 },
      overrides: { fswHz: 1_000_000, parts: { C2: 0.000047 } },
      note: 'Faster, cheaper',
    });
    const page = await engineerPage();

    await page.goto(`${baseUrl}/desk/briefs/${rail.briefId}/compare?a=${rail.revisionId}&b=${two.id}`);
    const inputs = page.locator('table[data-compare="inputs"]');
    const text = (await inputs.textContent()) ?? '';
    expect(text).toContain('Switching frequency');
    expect(text).toContain('1 MHz');
    expect(text).toContain('Forced value of C2');
    expect(text).toContain('47 µF');
    expect(text).toContain('Efficiency weight');
    expect(await page.locator('main').textContent()).not.toMatch(/overrides\.|weights\.|1000000|0\.000047/);
    await screenshot(page, 'compare-labelled-1366');

    await page.goto(`${baseUrl}/desk/briefs/${rail.briefId}/revisions/${two.id}`);
    const main = (await page.locator('main').textContent()) ?? '';
    expect(main).toContain('Efficiency weight: 0');
    expect(main).toContain('Switching frequency: 1 MHz');
    expect(main).toContain('Kind of load');
    const choices = page.locator('dl > div').filter({ has: page.locator('dt', { hasText: 'Weights, overrides' }) });
    expect(await choices.textContent()).not.toMatch(/weights\.|overrides\.|=/);

    await page.setViewportSize(PHONE);
    await openReview(page, `/desk/briefs/${rail.briefId}?from=${two.id}`);
    expect(await page.getByLabel('Switching frequency').inputValue()).toBe('1M');
    expect(await page.getByLabel('Value').inputValue()).toBe('47µ');
    expect(await page.getByText('Digital logic').count()).toBeGreaterThan(0);
    await screenshot(page, 'review-start-from-390');
    await page.context().close();
  });
});
