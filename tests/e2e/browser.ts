import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { DEMO_PASSWORD } from '../../src/lib/demo/scenario';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const SCREENSHOT_DIR = path.resolve('tests/.artifacts/screenshots');

/** Headless Chromium with the flags this closed-network machine needs. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** One browser for a test file: launched before its tests, closed after them. */
export function useBrowser(): () => Browser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return () => {
    if (!browser) throw new Error('The browser is not running yet.');
    return browser;
  };
}

/** Astro drops an island's `ssr` attribute once it has hydrated: until then clicks reach plain HTML. */
export async function islandsReady(page: Page): Promise<void> {
  await page.waitForFunction(() => document.querySelectorAll('astro-island[ssr]').length === 0, undefined, { timeout: 30_000 });
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

export async function signInThroughForm(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

/** One step of a quality's weight on the review's "what matters most" control. */
export const weightStep = (page: Page, quality: string, step: string) =>
  page.getByRole('radiogroup', { name: quality, exact: true }).getByLabel(step, { exact: true });

/** Sets a quality's step the way a person does: by clicking its word. */
export const chooseWeight = (page: Page, quality: string, step: string) =>
  page
    .getByRole('radiogroup', { name: quality, exact: true })
    .locator('label')
    .filter({ hasText: new RegExp(`^${step}$`) })
    .click();
