// The wizard in the words and places a client reads: numbers as the trade writes them, errors
// beside the fields that cause them at both widths, a live panel without engineers' symbols or
// the figures of designs nobody will build, and history times in the viewer's own time zone.
import { describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { islandsReady, screenshot, signInThroughForm, useBrowser } from './browser';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

const WIDTHS = [
  ['phone', { width: 390, height: 844 }],
  ['laptop', { width: 1366, height: 900 }],
] as const;

async function fill(page: Page, label: string, value: string) {
  const field = page.getByLabel(label, { exact: true });
  await field.fill(value);
  await field.blur();
}

async function settledPanel(page: Page): Promise<string> {
  const panel = page.getByRole('region', { name: 'Ways to build it' });
  await expect.poll(() => panel.textContent(), { timeout: 15_000 }).not.toContain('Updating');
  return (await panel.textContent()) ?? '';
}

async function openWizard(page: Page) {
  await page.goto(`${baseUrl}/briefs/new`);
  await islandsReady(page);
  await page.getByRole('heading', { name: /Step 1 of 7: Source/ }).waitFor();
}

describe('the wizard reads as a client expects', () => {
  test.each(WIDTHS)('at %s width: trade notations, errors beside their fields, wording for either layout', async (label, viewport) => {
    const context = await browser().newContext({ viewport });
    const page = await context.newPage();
    await openWizard(page);
    // The ranking sits beside the form on a laptop and below it on a phone: the intro names neither.
    const intro = (await page.locator('main p').first().textContent()) ?? '';
    expect(intro).not.toMatch(/on the right|below/);
    expect(intro).toContain('The list of ways to build it updates as you type');

    await fill(page, 'Lowest input voltage', '10');
    await fill(page, 'Nominal input voltage', '12');
    await fill(page, 'Highest input voltage', '14');
    // A nominal above the highest shows its error beside the fields at once, before Next.
    await fill(page, 'Nominal input voltage', '20');
    const orderError = page.locator('#f-spec-input-vMax-error');
    await expect.poll(() => orderError.textContent(), { timeout: 5_000 }).toContain('must not be below the nominal one');
    const errorBox = (await orderError.boundingBox())!;
    const nextBox = (await page.getByRole('button', { name: 'Next' }).boundingBox())!;
    expect(errorBox.y).toBeLessThan(nextBox.y);
    expect(await orderError.isVisible()).toBe(true);
    await screenshot(page, `wizard-words-${label}-order-error`);
    await fill(page, 'Nominal input voltage', '12');
    await expect.poll(() => orderError.count()).toBe(0);

    // Written as the trade writes it: a decimal comma and the unit as the decimal point.
    await fill(page, 'Lowest input voltage', '9,5');
    expect(await page.locator('#f-spec-input-vMin-error').count()).toBe(0);
    await page.getByRole('button', { name: 'Next' }).click();
    await fill(page, 'Name of the rail', `Notation rail (${label})`);
    await fill(page, 'Output voltage', '3V3V');
    const outError = page.locator('#f-spec-output-v-error');
    expect(await outError.textContent()).toContain('Write a number like 3.3, 3,3, 3V3, 4k7 or 100m.');
    expect(await page.getByLabel('Output voltage', { exact: true }).inputValue()).toBe('3V3V');
    await screenshot(page, `wizard-words-${label}-notation-error`);
    await fill(page, 'Output voltage', '3V3');
    expect(await outError.count()).toBe(0);
    await page.getByRole('button', { name: 'Next' }).click();
    await fill(page, 'Highest load current', '1A5');
    await fill(page, 'Typical load current', '0,5');
    expect(await page.locator('[id$="-error"]').count()).toBe(0);
    for (let i = 0; i < 4; i++) await page.getByRole('button', { name: 'Next' }).click();
    await page.getByRole('heading', { name: /Review/ }).waitFor();
    const review = (await page.locator('main').textContent()) ?? '';
    expect(review).toContain('9.5 V – 14 V (nominal 12 V)');
    expect(review).toContain('3.3 V ±5.0 %');
    expect(review).toContain('500 mA / 1.5 A');
    await context.close();
  });

  test.each(WIDTHS)('at %s width: the live panel speaks plainly and shows only buildable options’ cautions', async (label, viewport) => {
    const context = await browser().newContext({ viewport });
    const page = await context.newPage();
    await openWizard(page);
    // Rectified mains to a 150 V bias rail: hazardous voltage, and options that cannot be built.
    await page.getByLabel('What feeds the rail?').selectOption('rectified');
    await fill(page, 'Lowest input voltage', '300');
    await fill(page, 'Nominal input voltage', '325');
    await fill(page, 'Highest input voltage', '350');
    await fill(page, 'Ripple on the input', '4');
    await page.getByRole('button', { name: 'Next' }).click();
    await fill(page, 'Name of the rail', `Detector bias (${label})`);
    await fill(page, 'Output voltage', '150');
    await page.getByRole('button', { name: 'Next' }).click();
    await fill(page, 'Highest load current', '20m');
    await fill(page, 'Typical load current', '10m');
    await fill(page, 'Lowest load current', '2m');
    await expect.poll(() => settledPanel(page), { timeout: 20_000 }).toMatch(/\d of \d ways work for this rail/);
    const panel = await settledPanel(page);
    expect(panel).not.toMatch(/θ|K\/W|mK/);
    const cautions = (await page.getByRole('note').textContent()) ?? '';
    expect(cautions).toContain('ES1 limit');
    // No part references or figures of a particular design: those belong to the engineer's review.
    expect(cautions).not.toMatch(/\((?:about|beyond)|½·C·V²|[QDRCU]\d/);
    for (const line of await page.getByRole('list', { name: 'Ways that can’t be built' }).locator('li').allTextContents())
      expect(line).toMatch(/^[^:]+: it [a-z].*\.$/);
    await screenshot(page, `wizard-words-${label}-panel`);

    // Nothing can be built: the panel says so and why, in one plain sentence.
    await fill(page, 'Highest load current', '900');
    await expect.poll(() => settledPanel(page), { timeout: 20_000 }).toContain('None of the');
    expect(await settledPanel(page)).toMatch(/None of the \d ways can be built as the brief stands: the main reason is that/);
    await screenshot(page, `wizard-words-${label}-nothing`);
    await context.close();
  });
});

describe('times in the viewer’s time zone', () => {
  const zone = 'America/New_York';
  const inZone = (iso: string) =>
    new Intl.DateTimeFormat('en-GB', {
      day: 'numeric',
      month: 'short',
      year: 'numeric',
      hour: '2-digit',
      minute: '2-digit',
      timeZoneName: 'short',
      timeZone: zone,
    }).format(new Date(iso));

  test.each([
    ['a client’s brief history', 'client@demo.railwright.test', 'brief-history-phone'],
    ['the mail log', 'admin@demo.railwright.test', 'mail-log-phone'],
  ] as const)('%s gives the date and time in the viewer’s zone, with the instant in datetime', async (_what, email, shot) => {
    const context = await browser().newContext({ timezoneId: zone, viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await signInThroughForm(page, baseUrl, email);
    if (email.startsWith('client')) {
      await page.goto(`${baseUrl}/briefs`);
      await page.locator('a[href^="/briefs/"]:not([href="/briefs/new"])').first().click();
    } else {
      // A password-reset request puts a mail in the log.
      await page.goto(`${baseUrl}/forgot-password`);
      await page.getByLabel('E-mail').fill('client@demo.railwright.test');
      await page.locator('main form button[type="submit"]').click();
      await page.waitForLoadState('networkidle');
      await page.goto(`${baseUrl}/admin/mail`);
    }
    // Each time wakes as it comes into view (a long mail log never wakes all at once): poll the first.
    const first = page.locator('main time').first();
    await first.scrollIntoViewIfNeeded();
    const iso = (await first.getAttribute('datetime'))!;
    expect(iso).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
    await expect.poll(() => first.textContent()).toBe(inZone(iso));
    await screenshot(page, shot);
    await context.close();
  });
});
