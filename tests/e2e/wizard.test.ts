import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { islandsReady, useBrowser, screenshot } from './browser';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

const fixture = (name: string) => path.resolve('tests/fixtures/e2e', name);

async function fill(page: Page, label: string | RegExp, value: string) {
  const field = page.getByLabel(label, { exact: typeof label === 'string' });
  await field.fill(value);
  await field.blur();
}

async function rankingText(page: Page): Promise<string> {
  const panel = page.getByRole('region', { name: 'Ways to build it' });
  await expect.poll(() => panel.textContent(), { timeout: 10_000 }).not.toContain('Updating');
  return (await panel.textContent()) ?? '';
}

describe('a new client describes a rail', () => {
  test.each([
    ['phone', { width: 390, height: 844 }],
    ['laptop', { width: 1366, height: 900 }],
  ] as const)(
    'fills the wizard at %s width, sees the ranking react, attaches files, signs up at submit and finds the brief',
    async (label, viewport) => {
      const context = await browser().newContext({ viewport });
      const page = await context.newPage();
      const errors: string[] = [];
      page.on('pageerror', (e) => errors.push(e.message));

      await page.goto(`${baseUrl}/briefs/new`);
      await islandsReady(page);
      await page.getByRole('heading', { name: /Step 1 of 7: Source/ }).waitFor();
      await page.getByLabel('What feeds the rail?').selectOption('bus');
      await page.getByRole('button', { name: 'Use typical figures for this source' }).click();
      // 18–30 V in, 5 V out: a step-down switcher should head the list.
      await expect.poll(() => rankingText(page), { timeout: 15_000 }).toContain('Buck (step-down) switcher');
      const before = await rankingText(page);
      // The ways that work side by side, the pick first; the others said in a client's words, no device figures.
      const panel = page.getByRole('region', { name: 'Ways to build it' });
      expect(await panel.locator('thead th[data-column]').first().textContent()).toContain('Our pick');
      expect(await panel.getByRole('list', { name: 'Ways that can’t be built' }).textContent()).not.toMatch(/θ|SOA|K\/W/);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(viewport.width);
      await page.getByRole('button', { name: 'Next' }).click();

      await fill(page, 'Name of the rail', `Valve driver 5 V (${label})`);
      await fill(page, 'Output voltage', '5');
      await page.getByRole('button', { name: 'Next' }).click();
      await page.getByRole('heading', { name: /Load/ }).waitFor();
      await fill(page, 'Highest load current', '800m');
      // The optional load step and the deviation it may cause; empty means not asked for.
      await fill(page, 'Load step (optional)', '300m');
      await fill(page, 'Allowed dip or overshoot during the step', '100m');
      await page.getByRole('button', { name: 'Back' }).click();
      await page.getByRole('button', { name: 'Back' }).click();

      // Changing the input range to straddle the output changes the ranking.
      await fill(page, 'Lowest input voltage', '4.2');
      await fill(page, 'Nominal input voltage', '5');
      await fill(page, 'Highest input voltage', '6');
      await expect.poll(() => rankingText(page), { timeout: 15_000 }).not.toBe(before);
      await expect.poll(() => rankingText(page)).toContain('Buck-boost switcher');
      await screenshot(page, `wizard-${label}-source`);

      // Bad input gets a message in plain words beside the field.
      await fill(page, 'Lowest input voltage', 'abc');
      await page.getByRole('button', { name: 'Next' }).click();
      expect(await page.locator('#f-spec-input-vMin-error').textContent()).toContain(
        '“abc” does not read as a number. Write a number like 3.3, 3,3, 3V3, 4k7 or 100m.',
      );
      expect(await page.getByLabel('Lowest input voltage', { exact: true }).getAttribute('aria-invalid')).toBe('true');
      // What was typed stays in the box beside its error, to be corrected rather than retyped.
      expect(await page.getByLabel('Lowest input voltage', { exact: true }).inputValue()).toBe('abc');
      await fill(page, 'Lowest input voltage', '4.5');

      for (let i = 0; i < 5; i++) await page.getByRole('button', { name: 'Next' }).click();
      await page.getByRole('heading', { name: /Files and notes/ }).waitFor();
      await page.getByLabel(/Schematics, datasheets/).setInputFiles([fixture('node-load-log.csv'), fixture('node-schematic.pdf')]);
      await page.getByText(/61 samples over 60 s/).waitFor();
      await page.getByRole('button', { name: 'Use these figures for the load' }).click();
      await fill(page, 'Anything else we should know', 'Valve coils switch every 15 s.');
      await screenshot(page, `wizard-${label}-files`);
      await page.getByRole('button', { name: 'Next' }).click();

      await page.getByRole('heading', { name: /Review/ }).waitFor();
      // The review shows everything that will be sent: the nominal input, the load step and the notes.
      const review = (await page.locator('main').textContent()) ?? '';
      expect(review).toContain('nominal 5 V');
      expect(review).toContain('300 mA, at most 100 mV deviation');
      expect(review).toContain('Valve coils switch every 15 s.');
      await page.getByRole('button', { name: 'Submit the brief' }).click();
      const email = `wizard-${label}-${Date.now()}@example.test`;
      await page.getByRole('heading', { name: 'Create an account to submit' }).waitFor();
      await page.getByLabel('Your name').fill('Mirela Dukic');
      await page.getByLabel('Company or lab').fill('Dukic Fluidics');
      await page.getByLabel('E-mail').fill(email);
      await page.getByLabel('Password').fill('a-long-password-1');
      await screenshot(page, `wizard-${label}-account`);
      await page.getByRole('button', { name: 'Create account and submit' }).click();

      await page.waitForURL(/\/briefs\/[^/?]+\?submitted=1$/, { timeout: 20_000 });
      await page.getByRole('heading', { name: `Valve driver 5 V (${label})` }).waitFor();
      expect(await page.locator('h1 + span').textContent()).toContain('Submitted');
      expect(await page.getByRole('list', { name: 'State history, oldest first' }).locator('li').last().textContent()).toContain(
        'Draft → Submitted',
      );
      expect(await page.getByRole('link', { name: 'node-load-log.csv' }).count()).toBe(1);
      expect(await page.getByRole('link', { name: 'node-schematic.pdf' }).count()).toBe(1);
      await screenshot(page, `wizard-${label}-submitted`);

      await page.goto(`${baseUrl}/briefs`);
      expect(await page.getByRole('link', { name: `Valve driver 5 V (${label})` }).count()).toBe(1);
      expect(errors).toEqual([]);
      await context.close();
    },
  );

  test('a signed-in client’s draft is saved to the server and restored after leaving', async () => {
    const context = await browser().newContext();
    const page = await context.newPage();
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('client@demo.railwright.test');
    await page.getByLabel('Password').fill('railwright-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/briefs$/);
    await page.goto(`${baseUrl}/briefs/new`);
    await islandsReady(page);
    await page.getByRole('button', { name: 'Next' }).click();
    await fill(page, 'Name of the rail', 'Draft that survives');
    await fill(page, 'Output voltage', '3.3');
    await expect.poll(() => page.url(), { timeout: 10_000 }).toContain('draft=');
    await expect.poll(() => page.getByText(/Draft saved/).count(), { timeout: 10_000 }).toBe(1);
    const url = page.url();
    await page.goto(`${baseUrl}/briefs`);
    await page.goto(url);
    await islandsReady(page);
    await page.getByRole('button', { name: /Rail/ }).click();
    expect(await page.getByLabel('Name of the rail').inputValue()).toBe('Draft that survives');
    expect(await page.getByLabel('Output voltage').inputValue()).toBe('3.3');
    await context.close();
  });
});
