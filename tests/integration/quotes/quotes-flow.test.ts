import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { DEMO_RATE_CARD } from '../../../src/lib/demo/scenario';
import { execSql, mailsTo, pdfText, railUnderReview } from './helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const databaseUrl = inject('databaseUrl');

interface Line {
  kind: string;
  description: string;
  quantityMilli: number;
  unit: string;
  unitPriceMinor: number;
  totalMinor: number;
}

async function draft(engineer: Visitor, revisionId: string, quantity?: number) {
  const response = await engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId, ...(quantity ? { quantity } : {}) } });
  expect(response.status).toBe(201);
  return response.json();
}

describe('drafting a quote from a revision', () => {
  test('lines come from the rate card and the revision; totals, tax and deposit are the server’s', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await draft(rail.engineer, rail.revisionId);
    expect(quote.number).toMatch(new RegExp(`^RW-${new Date().getUTCFullYear()}-\\d{4}$`));
    expect(quote).toMatchObject({ state: 'draft', currency: 'EUR', quantity: 1, taxRateBp: 2000, depositBp: 3000 });
    const lines: Line[] = quote.lines;
    expect(lines.map((l) => l.kind)).toEqual(['design', 'design', 'parts', 'prototype', 'test-report']);
    // Buck: 12 h of design plus 1.5 h for its one revision, at the demo card's €115.00 an hour.
    expect(lines[0]).toMatchObject({ quantityMilli: 12_000, unit: 'h', unitPriceMinor: 11_500, totalMinor: 138_000 });
    expect(lines[1]).toMatchObject({ quantityMilli: 1_500, unitPriceMinor: 11_500, totalMinor: 17_250 });
    expect(lines[3]).toMatchObject({ quantityMilli: 1_000, unitPriceMinor: DEMO_RATE_CARD.prototypePerUnitMinor });
    expect(lines[4]).toMatchObject({ quantityMilli: 1_000, unitPriceMinor: DEMO_RATE_CARD.testReportMinor });
    const parts = lines[2]!.unitPriceMinor;
    expect(parts).toBeGreaterThan(0);
    const subtotal = 138_000 + 17_250 + parts + 9_500 + 36_000;
    expect(quote.subtotalMinor).toBe(subtotal);
    expect(quote.taxMinor).toBe(Math.round(subtotal * 0.2));
    expect(quote.totalMinor).toBe(subtotal + Math.round(subtotal * 0.2));
    expect(quote.depositMinor).toBe(Math.round(quote.totalMinor * 0.3));
    // Valid for the card's 30 days, to the end of the last day.
    const days = (Date.parse(quote.validUntil) - Date.parse(quote.createdAt)) / 86_400_000;
    expect(days).toBeGreaterThan(30);
    expect(days).toBeLessThanOrEqual(31);
    expect(quote.design.cautions.join(' ')).toContain('Hot surfaces');
  });

  test('numbers are sequential in the year, also when drafted at the same moment', async () => {
    const rail = await railUnderReview(baseUrl);
    const quotes = await Promise.all(Array.from({ length: 6 }, () => draft(rail.engineer, rail.revisionId)));
    const sequences = quotes.map((q) => Number(q.number.slice(-4))).sort((a, b) => a - b);
    expect(new Set(sequences).size).toBe(6);
    expect(sequences.at(-1)! - sequences[0]!).toBe(5);
    const next = await draft(rail.engineer, rail.revisionId);
    expect(Number(next.number.slice(-4))).toBe(sequences.at(-1)! + 1);
  });

  test('only staff draft; a draft is invisible to clients; unknown revisions are a 404; bad bodies a 400', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await draft(rail.engineer, rail.revisionId);
    expect((await rail.client.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).status).toBe(403);
    expect((await new Visitor(baseUrl).request(`/api/v1/quotes/${quote.id}`)).status).toBe(401);
    expect((await rail.client.request(`/api/v1/quotes/${quote.id}`)).status).toBe(404);
    expect((await rail.client.request(`/api/v1/quotes/${quote.id}/pdf`)).status).toBe(404);
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    expect((await other.request(`/api/v1/quotes/${quote.id}`)).status).toBe(404);
    expect((await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: 'no-such-revision' } })).status).toBe(404);
    const bad = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId, quantity: 0 } });
    expect(bad.status).toBe(400);
    expect((await bad.json()).issues[0].path).toBe('quantity');
  });
});

describe('editing, sending and accepting', () => {
  test('draft → edit → send: one e-mail with the PDF, which reads back with the number, totals and cautions', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await draft(rail.engineer, rail.revisionId);

    // The client may not set totals; the server computes them.
    const forged = await rail.engineer.request(`/api/v1/quotes/${quote.id}`, { method: 'PATCH', json: { totalMinor: 1 } });
    expect(forged.status).toBe(400);
    expect((await rail.client.request(`/api/v1/quotes/${quote.id}`, { method: 'PATCH', json: { taxRateBp: 0 } })).status).toBe(403);

    const units = await (await rail.engineer.request(`/api/v1/quotes/${quote.id}`, { method: 'PATCH', json: { quantity: 3 } })).json();
    expect(units.lines.filter((l: Line) => l.kind === 'parts' || l.kind === 'prototype').map((l: Line) => l.quantityMilli)).toEqual([
      3_000, 3_000,
    ]);
    expect(units.lines[0].quantityMilli).toBe(12_000);

    const past = await rail.engineer.request(`/api/v1/quotes/${quote.id}`, { method: 'PATCH', json: { validUntil: '2001-01-01' } });
    expect(past.status).toBe(400);
    expect((await past.json()).issues[0].path).toBe('validUntil');

    const edited = await rail.engineer.request(`/api/v1/quotes/${quote.id}`, {
      method: 'PATCH',
      json: {
        lines: [
          { kind: 'design', description: 'Design of the buck switcher', quantityMilli: 2_500, unit: 'h', unitPriceMinor: 11_500 },
          { kind: 'parts', description: 'Parts per unit', quantityMilli: 3_000, unit: 'unit', unitPriceMinor: 333 },
          { kind: 'other', description: 'Returning-client discount', quantityMilli: 1_000, unit: 'item', unitPriceMinor: -5_000 },
        ],
        taxRateBp: 1_000,
        depositBp: 2_500,
        terms: 'Deposit on acceptance.\nBalance on delivery.',
      },
    });
    expect(edited.status).toBe(200);
    const priced = await edited.json();
    // 2.5 h × €115.00 = €287.50; 3 × €3.33 = €9.99; −€50.00 → subtotal €247.49.
    // Tax 10 % = €24.749 → €24.75; total €272.24; deposit 25 % = €68.06.
    expect(priced.lines.map((l: Line) => l.totalMinor)).toEqual([28_750, 999, -5_000]);
    expect(priced).toMatchObject({ subtotalMinor: 24_749, taxMinor: 2_475, totalMinor: 27_224, depositMinor: 6_806, quantity: 3 });

    const sent = await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' });
    expect(sent.status).toBe(200);
    const sentQuote = await sent.json();
    expect(sentQuote.state).toBe('sent');
    expect(sentQuote.sentAt).not.toBeNull();
    expect((await (await rail.client.request(`/api/v1/briefs/${rail.briefId}`)).json()).state).toBe('quoted');

    const messages = (await (await fetch(`${mailApiUrl}/messages?to=${encodeURIComponent(rail.email)}`)).json()).filter(
      (m: { subject: string }) => m.subject.startsWith('Quote '),
    );
    expect(messages).toHaveLength(1);
    const [message] = messages;
    expect(message.subject).toBe(`Quote ${quote.number}: Valve manifold, 12 V at 2 A from the 24 V bus`);
    expect(message.attachments).toEqual([
      expect.objectContaining({ index: 0, filename: `Railwright-quote-${quote.number}.pdf`, contentType: 'application/pdf' }),
    ]);
    const full = await (await fetch(`${mailApiUrl}/messages/${message.id}`)).json();
    expect(full.text).toContain(`${baseUrl}/quotes/${quote.id}`);
    expect(full.text).toContain('€272.24');
    expect(full.html).toContain(`href="${baseUrl}/quotes/${quote.id}"`);

    const attachment = new Uint8Array(await (await fetch(`${mailApiUrl}/messages/${message.id}/attachments/0`)).arrayBuffer());
    expect(Buffer.from(attachment.subarray(0, 5)).toString()).toBe('%PDF-');
    const text = pdfText(attachment).replace(/\s+/g, ' ');
    for (const expected of [
      quote.number,
      'Returning-client discount',
      '€247.49',
      '€24.75',
      '€272.24',
      '€68.06',
      'Hot surfaces',
      'typical values — confirm against the chosen part’s data',
      'local electrical codes and licensed practice',
      `${baseUrl}/quotes/${quote.id}`,
    ]) {
      expect(text).toContain(expected);
    }

    // The owner reads the sent quote and its PDF; another client still cannot.
    const read = await rail.client.request(`/api/v1/quotes/${quote.id}`);
    expect(read.status).toBe(200);
    const pdf = await rail.client.request(`/api/v1/quotes/${quote.id}/pdf`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    expect((await new Visitor(baseUrl).signIn(DEMO.otherClient).then((v) => v.request(`/api/v1/quotes/${quote.id}/pdf`))).status).toBe(404);

    // Sent is final: no more edits, no second send.
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}`, { method: 'PATCH', json: { taxRateBp: 0 } })).status).toBe(409);
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(409);
    expect((await mailsTo(mailApiUrl, rail.email)).filter((m) => m.subject.startsWith('Quote '))).toHaveLength(1);

    // The admin's mail log lists it with its attachment.
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const log = await (await admin.request('/admin/mail')).text();
    expect(log).toContain(`Quote ${quote.number}: Valve manifold`);
    expect(log).toContain(`/api/v1/quotes/${quote.id}/pdf`);
  });

  test('two sends at once mail the client once: the second is told the quote is being sent', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await draft(rail.engineer, rail.revisionId);
    const other = await new Visitor(baseUrl).signIn(DEMO.admin);
    const answers = await Promise.all([
      rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' }),
      other.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' }),
    ]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409]);
    expect((await mailsTo(mailApiUrl, rail.email)).filter((m) => m.subject.startsWith('Quote '))).toHaveLength(1);
  });

  test('accept: not before it is sent, only by its client, not twice → 409s; the brief moves to accepted', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await draft(rail.engineer, rail.revisionId);
    const early = await rail.client.request(`/api/v1/quotes/${quote.id}/accept`, { method: 'POST' });
    expect(early.status).toBe(409);
    expect((await early.json()).message).toContain('not been sent');

    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/accept`, { method: 'POST' })).status).toBe(403);
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    expect((await other.request(`/api/v1/quotes/${quote.id}/accept`, { method: 'POST' })).status).toBe(404);

    const accepted = await rail.client.request(`/api/v1/quotes/${quote.id}/accept`, { method: 'POST' });
    expect(accepted.status).toBe(200);
    expect((await accepted.json()).state).toBe('accepted');
    expect((await (await rail.client.request(`/api/v1/briefs/${rail.briefId}`)).json()).state).toBe('accepted');
    const twice = await rail.client.request(`/api/v1/quotes/${quote.id}/accept`, { method: 'POST' });
    expect(twice.status).toBe(409);
    expect((await twice.json()).message).toContain('accepted already');
  });

  test('after the validity date the quote and its brief expire; accepting is a 409', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await draft(rail.engineer, rail.revisionId);
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    // Time passes: the validity ended a minute ago.
    await execSql(databaseUrl, 'UPDATE quote SET valid_until = ? WHERE id = ?', [Date.now() - 60_000, quote.id]);
    const late = await rail.client.request(`/api/v1/quotes/${quote.id}/accept`, { method: 'POST' });
    expect(late.status).toBe(409);
    expect((await late.json()).message).toContain('expired');
    expect((await (await rail.client.request(`/api/v1/quotes/${quote.id}`)).json()).state).toBe('expired');
    const briefNow = await (await rail.engineer.request(`/api/v1/briefs/${rail.briefId}`)).json();
    expect(briefNow.state).toBe('expired');
    expect(JSON.stringify(briefNow)).toContain(`Quote ${quote.number} lapsed on`);
    const [stored] = await execSql(databaseUrl, 'SELECT state FROM quote WHERE id = ?', [quote.id]);
    expect(stored?.state).toBe('expired');
  });

  test('sending a newer quote withdraws the older one; the client can accept only the newer', async () => {
    const rail = await railUnderReview(baseUrl);
    const first = await draft(rail.engineer, rail.revisionId);
    expect((await rail.engineer.request(`/api/v1/quotes/${first.id}/send`, { method: 'POST' })).status).toBe(200);
    expect(
      (
        await rail.engineer.request(`/api/v1/briefs/${rail.briefId}`, {
          method: 'PATCH',
          json: { state: 'in-review', note: 'New quantity' },
        })
      ).status,
    ).toBe(200);
    const second = await draft(rail.engineer, rail.revisionId, 5);
    expect((await rail.engineer.request(`/api/v1/quotes/${second.id}/send`, { method: 'POST' })).status).toBe(200);
    expect((await (await rail.client.request(`/api/v1/quotes/${first.id}`)).json()).state).toBe('withdrawn');
    const history = (await (await rail.engineer.request(`/api/v1/briefs/${rail.briefId}`)).json()).quotes;
    expect(history.map((q: { state: string }) => q.state)).toEqual(['withdrawn', 'sent']);
    const refused = await rail.client.request(`/api/v1/quotes/${first.id}/accept`, { method: 'POST' });
    expect(refused.status).toBe(409);
    expect((await refused.json()).message).toContain('withdrawn');
    expect((await (await rail.client.request(`/api/v1/briefs/${rail.briefId}`)).json()).state).toBe('quoted');
    expect((await rail.client.request(`/api/v1/quotes/${second.id}/accept`, { method: 'POST' })).status).toBe(200);
  });

  test('the client’s quote page shows the quote, cautions, the deposit and accepts without JavaScript', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await draft(rail.engineer, rail.revisionId);
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    const page = await (await rail.client.request(`/quotes/${quote.id}`)).text();
    expect(page).toContain(quote.number);
    expect(page).toContain('Hot surfaces');
    expect(page).toContain('confirm against the chosen part’s data');
    expect(page).toContain('Payment opens once the quote is accepted.');
    // Accepting is a confirming step on the page (a plain link), then its form.
    expect(page).toContain(`/quotes/${quote.id}?confirm=accept`);
    expect(await (await rail.client.request(`/quotes/${quote.id}?confirm=accept`)).text()).toContain(`Accept quote ${quote.number}`);
    const posted = await rail.client.form(`/quotes/${quote.id}`, { decision: 'accept' });
    expect(posted.status).toBe(303);
    expect(await (await rail.client.follow(posted)).text()).toContain(`quote ${quote.number} is accepted`);
    expect((await (await rail.client.request(`/api/v1/quotes/${quote.id}`)).json()).state).toBe('accepted');
  });
});
