import { describe, expect, inject, test } from 'vitest';
import { islandsReady, screenshot, signInThroughForm, useBrowser } from './browser';
import { DEMO } from '../support/client';
import { railUnderReview } from '../integration/quotes/helpers';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

/** Narrower than this, "12.5" or "item" no longer shows whole in a box. */
const LEAST_BOX_PX = 56;

describe('the quote builder fits the screen it is on', () => {
  test('at 1366 and 390 px no page scrolls sideways and every line box is wide enough to read', async () => {
    const rail = await railUnderReview(baseUrl);
    const drafted = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } });
    expect(drafted.status).toBe(201);
    const { id } = (await drafted.json()) as { id: string };
    const page = await (await browser().newContext({ viewport: { width: 1366, height: 900 } })).newPage();
    await signInThroughForm(page, baseUrl, DEMO.engineer);
    await page.goto(`${baseUrl}/desk/quotes/${id}`);
    await islandsReady(page);

    for (const width of [1366, 390]) {
      await page.setViewportSize({ width, height: 900 });
      await page.getByRole('textbox', { name: 'Quantity, line 1' }).fill('12.5');
      await page.getByRole('textbox', { name: 'Unit, line 1' }).fill('hours');
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
      const boxes = await page.locator('input[aria-label*=", line "], select[aria-label*=", line "]').evaluateAll((els) =>
        els.map((e) => ({
          name: e.getAttribute('aria-label') ?? '',
          width: e.getBoundingClientRect().width,
          clipped: e.scrollWidth > e.clientWidth,
        })),
      );
      expect(boxes.length).toBeGreaterThan(0);
      for (const box of boxes) expect(box.width, `${box.name} at ${width} px`).toBeGreaterThanOrEqual(LEAST_BOX_PX);
      // What was typed shows whole.
      expect(boxes.filter((b) => b.clipped && /^(Quantity|Unit),/.test(b.name))).toEqual([]);
      await screenshot(page, `quote-builder-${width}`);
    }
    await page.context().close();
  });
});
