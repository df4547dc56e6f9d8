import { describe, expect, inject, test } from 'vitest';
import { islandsReady, screenshot, signInThroughForm, useBrowser } from './browser';
import { DEMO } from '../support/client';
import { CLIENT_PASSWORD, railUnderReview } from '../integration/quotes/helpers';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

describe('sending a brief back for changes', () => {
  test('the engineer asks for a change, the client edits it in the wizard and resubmits, the review shows what changed', async () => {
    const rail = await railUnderReview(baseUrl);
    const errors: string[] = [];

    const desk = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const engineer = await desk.newPage();
    engineer.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(engineer, baseUrl, DEMO.engineer);
    await engineer.goto(`${baseUrl}/desk/briefs/${rail.briefId}`);
    await engineer.getByLabel('Move this brief to').selectOption('changes-requested');
    await engineer.locator('#move-note').fill('Does the 36 V maximum include load-dump spikes? Please check it.');
    await engineer.getByRole('button', { name: 'Move' }).click();
    await engineer.getByText('State changed; the history below records it.').waitFor();

    const phone = await browser().newContext({ viewport: { width: 390, height: 844 } });
    const client = await phone.newPage();
    client.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(client, baseUrl, rail.email, CLIENT_PASSWORD);
    await client.goto(`${baseUrl}/briefs/${rail.briefId}`);
    await client.getByRole('link', { name: 'Change the brief and submit it again' }).click();
    await client.getByRole('heading', { name: 'The engineer asked for changes' }).waitFor();
    await islandsReady(client);
    const highest = client.getByLabel('Highest input voltage', { exact: true });
    await highest.fill('42');
    await highest.blur();
    await screenshot(client, 'changes-client-wizard');
    for (let step = 0; step < 6 && (await client.getByRole('button', { name: 'Submit the brief' }).count()) === 0; step++)
      await client.getByRole('button', { name: 'Next' }).click();
    await client.getByRole('button', { name: 'Submit the brief' }).click();
    await client.waitForURL(new RegExp(`/briefs/${rail.briefId}\\?submitted=1$`), { timeout: 20_000 });
    await phone.close();

    await engineer.reload();
    const changes = engineer.getByRole('region', { name: 'Changed since version 1' });
    await changes.waitFor();
    const row = changes.getByRole('row', { name: /Highest input voltage/ });
    expect(await row.textContent()).toMatch(/36 V.*42 V/);
    await changes.scrollIntoViewIfNeeded();
    await screenshot(engineer, 'changes-desk-diff');
    await desk.close();
    expect(errors).toEqual([]);
  });
});
