import { describe, expect, inject, test } from 'vitest';
import { useBrowser, screenshot, signInThroughForm } from './browser';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

describe('each role in the browser', () => {
  test('the front page reads without JavaScript and invites a brief', async () => {
    const context = await browser().newContext({ javaScriptEnabled: false });
    const page = await context.newPage();
    await page.goto(baseUrl);
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toContain('designed for its worst day');
    expect(await page.getByRole('link', { name: 'Describe your rail' }).count()).toBe(1);
    await screenshot(page, 'front-page');
    await context.close();
  });

  test.each([
    ['client', 'client@demo.railwright.test', '/briefs', ['My briefs'], ['Desk', 'People']],
    ['engineer', 'engineer@demo.railwright.test', '/desk', ['Desk'], ['My briefs', 'People']],
    ['admin', 'admin@demo.railwright.test', '/desk', ['Desk', 'People'], ['My briefs']],
  ] as const)('the %s signs in and sees their own navigation', async (role, email, home, shown, hidden) => {
    const context = await browser().newContext({
      viewport: role === 'client' ? { width: 390, height: 844 } : { width: 1366, height: 900 },
    });
    const page = await context.newPage();
    await signInThroughForm(page, baseUrl, email);
    expect(new URL(page.url()).pathname).toBe(home);
    const nav = page.getByRole('navigation', { name: 'Main' });
    for (const label of shown) expect(await nav.getByRole('link', { name: label }).count(), label).toBe(1);
    for (const label of hidden) expect(await nav.getByRole('link', { name: label }).count(), label).toBe(0);
    await screenshot(page, `home-${role}`);
    await context.close();
  });

  test('a client who opens an engineer page gets the 403 page', async () => {
    const context = await browser().newContext();
    const page = await context.newPage();
    await signInThroughForm(page, baseUrl, 'client@demo.railwright.test');
    const response = await page.goto(`${baseUrl}/desk`);
    expect(response?.status()).toBe(403);
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('not open to your role');
    await screenshot(page, 'client-forbidden');
    await context.close();
  });

  test('an admin changes a role with the keyboard-usable form', async () => {
    const context = await browser().newContext();
    const page = await context.newPage();
    await signInThroughForm(page, baseUrl, 'admin@demo.railwright.test');
    await page.goto(`${baseUrl}/admin/users`);
    // The test stack signs up many buyers: find her as an admin would, by searching.
    await page.getByRole('search').getByRole('searchbox').fill('Ferrand');
    await page.keyboard.press('Enter');
    await page.waitForURL(/q=Ferrand/);
    const select = page.getByLabel('Role of Lucía Ferrand');
    await select.selectOption('engineer');
    await select.press('Tab');
    await page.keyboard.press('Enter');
    await page.getByRole('status').waitFor();
    expect(await page.getByRole('status').textContent()).toContain('Role changed to Engineer.');
    await page.getByLabel('Role of Lucía Ferrand').selectOption('client');
    await page.getByLabel('Role of Lucía Ferrand').press('Tab');
    await page.keyboard.press('Enter');
    await page.getByRole('status').waitFor();
    await screenshot(page, 'admin-people');
    await context.close();
  });
});

describe('the admin’s device catalog', () => {
  test('lists the typical parameters and opens one for editing', async () => {
    const context = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    await signInThroughForm(page, baseUrl, 'admin@demo.railwright.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Catalog' }).click();
    await page.getByRole('heading', { name: 'Device catalog' }).waitFor();
    await page.getByRole('region', { name: 'Thermal assumptions' }).getByRole('link', { name: 'Thermal assumptions' }).click();
    await page.getByText('Advanced: the figures as JSON (export or import)').click();
    expect(await page.getByLabel('Parameters (JSON, SI units)').inputValue()).toContain('tjMarginK');
    await screenshot(page, 'admin-catalog');
    await context.close();
  });
});
