import { describe, expect, inject, test } from 'vitest';
import { screenshot, signInThroughForm, useBrowser } from './browser';
import { CLIENT_PASSWORD, railUnderReview } from '../integration/quotes/helpers';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

describe('choosing notice e-mails', () => {
  test('a client reaches the account page from the header and turns message e-mails off', async () => {
    const rail = await railUnderReview(baseUrl);
    const errors: string[] = [];
    for (const viewport of [
      { width: 390, height: 844 },
      { width: 1366, height: 900 },
    ]) {
      const context = await browser().newContext({ viewport });
      const page = await context.newPage();
      page.on('pageerror', (e) => errors.push(e.message));
      await signInThroughForm(page, baseUrl, rail.email, CLIENT_PASSWORD);
      await page.getByRole('link', { name: rail.name }).click();
      await page.getByRole('heading', { name: 'E-mail notices' }).waitFor();
      const messages = page.getByLabel('A new message on a brief');
      if (viewport.width === 390) {
        expect(await messages.isChecked()).toBe(true);
        await messages.uncheck();
        await page.getByRole('button', { name: 'Save' }).click();
        await page.getByText('Saved. The e-mails you turned off will not be sent to you.').waitFor();
      }
      expect(await messages.isChecked()).toBe(false);
      expect(await page.getByLabel('Your brief reached us').isChecked()).toBe(true);
      await screenshot(page, `account-notices-${viewport.width}`);
      await context.close();
    }
    expect(errors).toEqual([]);
  });
});
