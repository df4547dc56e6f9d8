/**
 * Client-facing and internal words on a quote: the note to the client reaches the quote page, the
 * PDF and the e-mail; the revision's note and the reason for quoting an infeasible design do not.
 */
import { describe, expect, inject, test } from 'vitest';
import { mailsTo, mailText, pdfText, railUnderReview } from './helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');

const REVISION_NOTE = 'Internal only: thin thermal margin, cheaper inductor';
const CLIENT_NOTE = 'We can ship the prototypes two weeks after the deposit.';

async function catcherHtml(id: string | undefined): Promise<string> {
  return (await (await fetch(`${mailApiUrl}/messages/${id}`)).json()).html ?? '';
}

describe('the note to the client and the internal notes', () => {
  test('the note to the client alone reaches the quote page, the PDF and the e-mail', async () => {
    const rail = await railUnderReview(baseUrl);
    const saved = await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`, {
      method: 'POST',
      json: { note: REVISION_NOTE },
    });
    expect(saved.status).toBe(201);
    const revisionId = (await saved.json()).id;
    const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId } })).json();
    expect(quote.clientNote).toBe('');

    const edited = await rail.engineer.request(`/api/v1/quotes/${quote.id}`, {
      method: 'PATCH',
      json: { clientNote: `  ${CLIENT_NOTE}  ` },
    });
    expect(edited.status).toBe(200);
    expect((await edited.json()).clientNote).toBe(CLIENT_NOTE);
    const tooLong = await rail.engineer.request(`/api/v1/quotes/${quote.id}`, { method: 'PATCH', json: { clientNote: 'x'.repeat(2001) } });
    expect(tooLong.status).toBe(400);
    expect((await tooLong.json()).issues[0].path).toBe('clientNote');
    // The engineer's own page keeps the revision note, marked internal.
    const builder = await (await rail.engineer.request(`/desk/quotes/${quote.id}`)).text();
    expect(builder).toContain(REVISION_NOTE);

    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    // Once sent, the note is fixed with the rest of the quote.
    const late = await rail.engineer.request(`/api/v1/quotes/${quote.id}`, { method: 'PATCH', json: { clientNote: 'Changed' } });
    expect(late.status).toBe(409);

    const page = await (await rail.client.request(`/quotes/${quote.id}`)).text();
    expect(page).toContain(CLIENT_NOTE);
    expect(page).not.toContain(REVISION_NOTE);

    const pdf = pdfText(new Uint8Array(await (await rail.client.request(`/api/v1/quotes/${quote.id}/pdf`)).arrayBuffer()));
    const flat = pdf.replace(/\s+/g, ' ');
    expect(flat).toContain(CLIENT_NOTE);
    expect(flat).not.toContain('thin thermal margin');
    expect(flat).not.toContain('Engineer’s note');

    const json = await (await rail.client.request(`/api/v1/quotes/${quote.id}`)).json();
    expect(json.clientNote).toBe(CLIENT_NOTE);
    expect(JSON.stringify(json)).not.toContain(REVISION_NOTE);

    const [mail] = await mailsTo(mailApiUrl, rail.email);
    const text = await mailText(mailApiUrl, mail?.id);
    expect(text).toContain(CLIENT_NOTE);
    expect(text).not.toContain(REVISION_NOTE);
    const html = await catcherHtml(mail?.id);
    expect(html).toContain(CLIENT_NOTE);
    expect(html).not.toContain(REVISION_NOTE);
  });

  test('a quote from a design that does not meet the brief needs a reason, kept on the quote and its history but never shown to the client', async () => {
    const rail = await railUnderReview(baseUrl);
    // A boost cannot step 24 V down to 12 V: the revision's chosen design is not feasible.
    const saved = await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`, {
      method: 'POST',
      json: { topology: 'boost', note: 'Boost for comparison' },
    });
    expect(saved.status).toBe(201);
    const revisionId = (await saved.json()).id;
    const revisions = await (await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`)).json();
    expect(revisions.items.map((r: { feasible: boolean }) => r.feasible)).toEqual([false, true]);

    for (const json of [{ revisionId }, { revisionId, infeasibleReason: '   ' }]) {
      const refused = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json });
      expect(refused.status).toBe(400);
      const body = await refused.json();
      expect(body.issues[0].path).toBe('infeasibleReason');
      expect(body.message).toContain('does not meet the brief');
    }
    // The page form asks the same, keeping what was typed.
    const form = await rail.engineer.form('/desk/quotes/new', { revisionId, quantity: '2', infeasibleReason: '' });
    expect(form.status).toBe(400);
    expect(await form.text()).toContain('Say why it is quoted all the same');

    const reason = 'The client accepts a 10 % shortfall on ripple for the first prototypes.';
    const drafted = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId, infeasibleReason: reason } });
    expect(drafted.status).toBe(201);
    const quote = await drafted.json();
    expect(quote.infeasibleReason).toBe(reason);
    const builder = await (await rail.engineer.request(`/desk/quotes/${quote.id}`)).text();
    expect(builder).toContain(reason);
    expect(builder).toContain(`Drafted from revision 2, whose design does not meet the brief: ${reason}`);

    // A feasible revision keeps no reason, whatever is sent.
    const feasible = await rail.engineer.request('/api/v1/quotes', {
      method: 'POST',
      json: { revisionId: rail.revisionId, infeasibleReason: 'not needed' },
    });
    expect((await feasible.json()).infeasibleReason).toBeNull();

    await rail.engineer.request(`/api/v1/quotes/${quote.id}`, { method: 'PATCH', json: { clientNote: CLIENT_NOTE } });
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    const clientJson = await (await rail.client.request(`/api/v1/quotes/${quote.id}`)).json();
    expect(clientJson).not.toHaveProperty('infeasibleReason');
    const page = await (await rail.client.request(`/quotes/${quote.id}`)).text();
    expect(page).not.toContain(reason);
    const pdf = pdfText(new Uint8Array(await (await rail.client.request(`/api/v1/quotes/${quote.id}/pdf`)).arrayBuffer()));
    expect(pdf.replace(/\s+/g, ' ')).not.toContain('shortfall on ripple');
    const [mail] = await mailsTo(mailApiUrl, rail.email);
    expect(await mailText(mailApiUrl, mail?.id)).not.toContain(reason);
  });

  test('the draft form offers the newest feasible revision first and marks each revision’s feasibility', async () => {
    const rail = await railUnderReview(baseUrl);
    const saved = await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`, { method: 'POST', json: { topology: 'boost' } });
    expect(saved.status).toBe(201);
    const html = await (await rail.engineer.request(`/desk/quotes/new?briefId=${rail.briefId}`)).text();
    const checked = html.match(/<input[^>]*type="radio"[^>]*>/g)?.filter((tag) => /\schecked/.test(tag)) ?? [];
    expect(checked).toHaveLength(1);
    expect(checked[0]).toContain(`value="${rail.revisionId}"`);
    expect(html).toContain('Not feasible');
    // Named by the review's link, the chosen revision is taken as named.
    const named = await (await rail.engineer.request(`/desk/quotes/new?revisionId=${(await saved.json()).id}`)).text();
    expect(named).toMatch(/data-feasible="false"[^>]*checked|checked[^>]*data-feasible="false"/);
    // The review lists each revision's feasibility and links to drafting from it.
    const review = await (await rail.engineer.request(`/desk/briefs/${rail.briefId}`)).text();
    expect(review).toContain(`/desk/quotes/new?revisionId=${rail.revisionId}`);
    expect(review).toContain('data-feasible="false"');
  });
});
