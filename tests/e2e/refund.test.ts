/** Staff refund a paid deposit from the desk quote page, at a desk and on a phone; the payment list shows both rows. */
import { describe, expect, inject, test } from 'vitest';
import { screenshot, signInThroughForm, useBrowser } from './browser';
import { DEMO } from '../support/client';
import { SUCCESS_CARD } from '../../stripe-fake/index';
import { acceptedQuote, openCheckout, pay, quoteState, until } from '../integration/payments/helpers';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

describe.each([
  { name: 'desk', viewport: { width: 1366, height: 900 } },
  { name: 'phone', viewport: { width: 390, height: 844 } },
])('a staff refund at $viewport.width px', ({ name, viewport }) => {
  test('the engineer gives the deposit back with a reason and the tick; the list shows it refunded, who and why', async () => {
    const rail = await acceptedQuote();
    const { url } = await openCheckout(rail.client, rail.quote.id);
    await pay(url, SUCCESS_CARD);
    await until(
      () => quoteState(rail.client, rail.quote.id),
      (s) => s === 'deposit-paid',
      'the deposit',
    );

    const context = await browser().newContext({ viewport });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(page, baseUrl, DEMO.engineer);
    await page.goto(`${baseUrl}/desk/quotes/${rail.quote.id}`);
    const payments = page.getByRole('region', { name: 'Payments' });
    await payments.getByText(/Refund the deposit of/).click();
    await payments.getByLabel('Why (the client reads this)').fill('The client’s project was stopped before the design began.');
    await screenshot(page, `refund-form-${name}`);

    // Without the tick the browser does not send the form.
    await payments.getByRole('button', { name: /^Refund / }).click();
    expect(await page.evaluate(() => location.search)).toBe('');
    await payments.getByLabel(/Yes, refund/).check();
    await payments.getByRole('button', { name: /^Refund / }).click();
    await page
      .getByRole('status')
      .getByText(/Refunded in full/)
      .waitFor();
    await payments.getByRole('cell', { name: /^Given back by / }).waitFor();
    await payments.getByText('“The client’s project was stopped before the design began.”').waitFor();
    expect(await payments.getByText(/Refund the deposit of/).count()).toBe(0);
    expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).toBe(true);
    await screenshot(page, `refund-done-${name}`);
    await context.close();
    expect(errors).toEqual([]);
  });
});
