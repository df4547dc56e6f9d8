import { describe, expect, inject, test } from 'vitest';
import { useBrowser, screenshot, signInThroughForm } from './browser';
import { DEMO } from '../support/client';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const browser = useBrowser();

describe('the admin pages in the browser', () => {
  test.each([
    ['wide', 1366, 900],
    ['phone', 390, 844],
  ] as const)(
    'an admin edits one catalog figure: a bad value is refused beside its field, a good one is saved (%s)',
    async (name, width, height) => {
      const context = await browser().newContext({ viewport: { width, height } });
      const page = await context.newPage();
      await signInThroughForm(page, baseUrl, DEMO.admin);
      await page.goto(`${baseUrl}/admin/catalog`);
      await screenshot(page, `admin-catalog-list-${name}`);
      await page.getByRole('region', { name: 'Thermal assumptions' }).getByRole('link', { name: 'Thermal assumptions' }).click();
      const margin = page.getByLabel('Margin kept below the junction limit');
      const before = await margin.inputValue();

      await margin.fill('-5');
      await page.getByRole('button', { name: 'Save Thermal assumptions' }).click();
      await page.waitForLoadState();
      // The message is tied to the field (aria-describedby) and sits right under it, not only in a banner.
      const describedBy = (await page.getByLabel('Margin kept below the junction limit').getAttribute('aria-describedby')) ?? '';
      const message = page.locator(`[id="${describedBy.split(' ').find((id) => id.endsWith('-error'))}"]`);
      expect(await message.textContent()).toContain('Must not be negative.');
      expect(await page.getByLabel('Margin kept below the junction limit').inputValue()).toBe('-5');
      const field = await page.getByLabel('Margin kept below the junction limit').boundingBox();
      const said = await message.boundingBox();
      expect((said?.y ?? 0) - ((field?.y ?? 0) + (field?.height ?? 0))).toBeLessThan(40);
      expect((said?.y ?? 0) - ((field?.y ?? 0) + (field?.height ?? 0))).toBeGreaterThanOrEqual(0);
      await screenshot(page, `admin-catalog-refused-${name}`);

      await page.getByLabel('Margin kept below the junction limit').fill(before);
      await page.getByRole('button', { name: 'Save Thermal assumptions' }).click();
      await page.waitForURL(/done=saved/);
      expect(await page.getByRole('status').first().textContent()).toContain('Saved.');
      expect(await page.getByLabel('Margin kept below the junction limit').inputValue()).toBe(before);
      await context.close();
    },
  );

  test.each([
    ['wide', 1366, 900],
    ['phone', 390, 844],
  ] as const)('an admin invites someone, who finds the e-mail with the set-password link (%s)', async (name, width, height) => {
    const email = `invited-${name}-${Date.now()}@example.test`;
    const context = await browser().newContext({ viewport: { width, height } });
    const page = await context.newPage();
    await signInThroughForm(page, baseUrl, DEMO.admin);
    await page.goto(`${baseUrl}/admin/users`);
    await page.getByLabel('Name', { exact: true }).fill('Ines Okafor');
    await page.getByLabel('E-mail', { exact: true }).fill(email);
    await page.getByLabel('Role', { exact: true }).selectOption('engineer');
    await page.getByRole('button', { name: 'Send the invitation' }).click();
    await page.waitForURL(/done=invited/);
    expect(await page.getByRole('status').first().textContent()).toContain('Invitation sent.');
    await page.getByLabel('Find by name or e-mail').fill('okafor');
    await page.getByRole('button', { name: 'Search' }).click();
    await page.waitForURL(/q=okafor/);
    expect(await page.getByRole('cell', { name: email }).count()).toBe(1);
    await screenshot(page, `admin-people-${name}`);

    const [message] = await (await fetch(`${mailApiUrl}/messages?to=${encodeURIComponent(email)}`)).json();
    const full = await (await fetch(`${mailApiUrl}/messages/${message.id}`)).json();
    expect(full.subject).toBe('You are invited to Railwright');
    const link = /https?:\/\/\S+\/reset-password\?token=\S+/.exec(full.text)?.[0] ?? '';
    expect(link).not.toBe('');

    const invitee = await browser().newContext({ viewport: { width, height } });
    const own = await invitee.newPage();
    await own.goto(link);
    await own.getByLabel('New password').fill('invited-in-browser-1');
    await own.getByRole('button', { name: 'Save the new password' }).click();
    await own.waitForURL(/\/sign-in/);
    await signInThroughForm(own, baseUrl, email, 'invited-in-browser-1');
    expect(new URL(own.url()).pathname).toBe('/desk');
    await invitee.close();
    await context.close();
  });
});
