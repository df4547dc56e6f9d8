import { describe, expect, inject, test } from 'vitest';
import { islandsReady, screenshot, signInThroughForm, useBrowser } from './browser';
import { DEMO } from '../support/client';
import { CLIENT_PASSWORD, railUnderReview } from '../integration/quotes/helpers';

const baseUrl = inject('baseUrl');
const browser = useBrowser();

describe('asking about a quote and answering on the brief', () => {
  test('the client asks from the quote page, the engineer answers on the review page, the client reads the answer', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    const errors: string[] = [];

    const phone = await browser().newContext({ viewport: { width: 390, height: 844 } });
    const client = await phone.newPage();
    client.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(client, baseUrl, rail.email, CLIENT_PASSWORD);
    await client.goto(`${baseUrl}/quotes/${quote.id}`);
    await client.getByRole('link', { name: 'Ask a question' }).click();
    await client.waitForURL(new RegExp(`/briefs/${rail.briefId}#messages$`));
    await islandsReady(client);
    await client.getByLabel('Write to the consultancy').fill('Is the prototype tested at 36 V as well?');
    await client.getByRole('button', { name: 'Send message' }).click();
    const thread = client.getByRole('list', { name: 'Messages, oldest first' });
    await thread.getByText('Is the prototype tested at 36 V as well?').waitFor();
    await screenshot(client, 'messages-client-asked');

    const desk = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const engineer = await desk.newPage();
    engineer.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(engineer, baseUrl, DEMO.engineer);
    await engineer.goto(`${baseUrl}/desk/briefs/${rail.briefId}#messages`);
    await engineer.getByText('Is the prototype tested at 36 V as well?').waitFor();
    await engineer.getByLabel('Write to the client').scrollIntoViewIfNeeded();
    await islandsReady(engineer);
    await engineer.getByLabel('Write to the client').fill('Yes: the bench test covers 18 V, 24 V and 36 V at full load.');
    await engineer.getByRole('button', { name: 'Send message' }).click();
    await engineer.getByRole('list', { name: 'Messages, oldest first' }).getByText('covers 18 V, 24 V and 36 V').waitFor();
    await screenshot(engineer, 'messages-desk-answered');
    await desk.close();

    await client.reload();
    await thread.getByText('covers 18 V, 24 V and 36 V').waitFor();
    await screenshot(client, 'messages-client-answered');
    await phone.close();
    expect(errors).toEqual([]);
  });
});
