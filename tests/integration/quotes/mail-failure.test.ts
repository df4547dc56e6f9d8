import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import { startAppServer, type AppServer } from '../../support/app-server';
import { freePort } from '../../support/ports';
import { DEMO, Visitor } from '../../support/client';
import { mailsTo, railUnderReview } from './helpers';

const mailApiUrl = inject('mailApiUrl');
const baseUrl = inject('baseUrl');

// A second app whose SMTP server is a closed port, so every send fails; it
// also reads the running mail catcher, so its mail log shows what that received.
let broken: AppServer;
beforeAll(async () => {
  broken = await startAppServer({ SMTP_URL: `smtp://127.0.0.1:${await freePort()}`, MAIL_FAKE_HTTP_URL: mailApiUrl });
});
afterAll(async () => {
  await broken?.stop();
});

describe('when the mail server refuses', () => {
  test('the quote is sent and its e-mail queued; the builder says it has not gone out and will be retried', async () => {
    const rail = await railUnderReview(broken.baseUrl);
    const drafted = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } });
    const quote = await drafted.json();

    const send = await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' });
    expect(send.status).toBe(200);
    expect((await send.json()).state).toBe('sent');
    expect((await (await rail.engineer.request(`/api/v1/briefs/${rail.briefId}`)).json()).state).toBe('quoted');
    // Sending again is refused: the mail is queued once, not twice.
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(409);

    const builder = await (await rail.engineer.request(`/desk/quotes/${quote.id}`)).text();
    expect(builder).toContain(`The e-mail to ${rail.email} has not gone out yet`);
    expect(builder).toContain('retried automatically');
    const admin = await new Visitor(broken.baseUrl).signIn(DEMO.admin);
    const page = await (await admin.request('/admin/mail')).text();
    // Only this app's own log: the catcher's section below lists other test apps' mail, whose quotes are numbered from 1 too.
    const ownLog = page.slice(page.indexOf('id="logged-heading"'), page.indexOf('id="caught-heading"'));
    expect(ownLog.split(`Quote ${quote.number}:`).length - 1).toBe(1);
    expect(ownLog).toContain('Failed');
  });

  test('the mail log also lists what the catcher received, with its attachments for download', async () => {
    // A quote sent by the working app lands in the catcher the broken app reads.
    const rail = await railUnderReview(baseUrl);
    const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    const message = (await mailsTo(mailApiUrl, rail.email)).find((m) => m.subject.startsWith('Quote '));

    const admin = await new Visitor(broken.baseUrl).signIn(DEMO.admin);
    const page = await (await admin.request('/admin/mail')).text();
    expect(page).toContain('Received by the local mail catcher');
    expect(page).toContain(`Quote ${quote.number}:`);
    const link = `/admin/mail?message=${encodeURIComponent(message?.id ?? '')}&attachment=0`;
    expect(page).toContain(`href="${link.replace('&', '&#38;')}"`);
    const download = await admin.request(link);
    expect(download.status).toBe(200);
    expect(download.headers.get('content-type')).toBe('application/pdf');
    expect(
      Buffer.from(await download.arrayBuffer())
        .subarray(0, 5)
        .toString(),
    ).toBe('%PDF-');

    const engineer = await new Visitor(broken.baseUrl).signIn(DEMO.engineer);
    expect((await engineer.request('/admin/mail')).status).toBe(403);
    expect((await admin.request('/admin/mail?message=..%2F..%2Fetc&attachment=0')).status).toBe(404);
  });
});
