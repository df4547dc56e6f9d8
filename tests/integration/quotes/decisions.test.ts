/**
 * The client's decisions on a sent quote: accepting with a purchase-order number (kept, shown and
 * printed on the deposit receipt) and declining with a reason (the quote ends declined, the brief
 * goes back to review, the engineer who drafted it is e-mailed once through the outbox).
 */
import { describe, expect, inject, test } from 'vitest';
import { SUCCESS_CARD } from '../../../stripe-fake/index';
import { DEMO, Visitor } from '../../support/client';
import { openCheckout, pay, quoteState, until } from '../payments/helpers';
import { execSql, mailsTo, mailText, railUnderReview } from './helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const databaseUrl = inject('databaseUrl');

async function sentQuote() {
  const rail = await railUnderReview(baseUrl);
  const drafted = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } });
  expect(drafted.status).toBe(201);
  const quote = (await drafted.json()) as { id: string; number: string; briefTitle: string };
  return {
    ...rail,
    quote,
    send: async () => expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200),
  };
}

const formPost = (visitor: Visitor, path: string, fields: Record<string, string>) =>
  visitor.request(path, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams(fields).toString(),
    redirect: 'manual',
  });

describe('accepting with a purchase-order number', () => {
  test('the number is kept trimmed, shown on the quote page and printed on the deposit receipt', async () => {
    const rail = await sentQuote();
    await rail.send();
    const tooLong = await rail.client.request(`/api/v1/quotes/${rail.quote.id}/accept`, {
      method: 'POST',
      json: { purchaseOrder: 'P'.repeat(41) },
    });
    expect(tooLong.status).toBe(400);
    expect((await tooLong.json()).issues[0].path).toBe('purchaseOrder');
    expect(await quoteState(rail.client, rail.quote.id)).toBe('sent');

    const accepted = await rail.client.request(`/api/v1/quotes/${rail.quote.id}/accept`, {
      method: 'POST',
      json: { purchaseOrder: '  4500-0192  ' },
    });
    expect(accepted.status).toBe(200);
    expect(await accepted.json()).toMatchObject({ state: 'accepted', purchaseOrder: '4500-0192' });
    expect(await (await rail.client.request(`/quotes/${rail.quote.id}`)).text()).toContain('Purchase order 4500-0192');

    const { url } = await openCheckout(rail.client, rail.quote.id);
    expect((await pay(url, SUCCESS_CARD)).status).toBe(303);
    const receipt = await until(
      async () => (await mailsTo(mailApiUrl, rail.email)).find((m) => m.subject.startsWith('Receipt: deposit')),
      Boolean,
      'the deposit receipt',
    );
    expect(await mailText(mailApiUrl, receipt?.id)).toMatch(/Your PO:\s+4500-0192/);
  });

  test('without a number the acceptance works as before and the receipt has no PO line', async () => {
    const rail = await sentQuote();
    await rail.send();
    const accepted = await rail.client.request(`/api/v1/quotes/${rail.quote.id}/accept`, { method: 'POST', json: {} });
    expect(accepted.status).toBe(200);
    expect((await accepted.json()).purchaseOrder).toBeNull();
    const { url } = await openCheckout(rail.client, rail.quote.id);
    await pay(url, SUCCESS_CARD);
    const receipt = await until(
      async () => (await mailsTo(mailApiUrl, rail.email)).find((m) => m.subject.startsWith('Receipt: deposit')),
      Boolean,
      'the deposit receipt',
    );
    expect(await mailText(mailApiUrl, receipt?.id)).not.toContain('Your PO');
  });

  test('the page takes the number in its confirming step', async () => {
    const rail = await sentQuote();
    await rail.send();
    const page = await (await rail.client.request(`/quotes/${rail.quote.id}`)).text();
    // The first view offers the choice; nothing on it accepts in one click.
    expect(page).toContain(`?confirm=accept`);
    expect(page).not.toContain('name="decision"');
    const confirming = await (await rail.client.request(`/quotes/${rail.quote.id}?confirm=accept`)).text();
    expect(confirming).toContain('Confirm your acceptance');
    expect(confirming).toContain('name="purchaseOrder"');

    const posted = await formPost(rail.client, `/quotes/${rail.quote.id}`, { decision: 'accept', purchaseOrder: 'PO 88' });
    expect(posted.status).toBe(303);
    expect(posted.headers.get('location')).toBe(`/quotes/${rail.quote.id}?done=accepted`);
    expect((await (await rail.client.request(`/api/v1/quotes/${rail.quote.id}`)).json()).purchaseOrder).toBe('PO 88');
  });
});

describe('declining with a reason', () => {
  test('who may decline, and when', async () => {
    const rail = await sentQuote();
    const path = `/api/v1/quotes/${rail.quote.id}/decline`;
    const reason = { reason: 'Over our budget for this run.' };
    expect((await rail.client.request(path, { method: 'POST', json: reason })).status).toBe(409); // not sent yet
    await rail.send();
    expect((await new Visitor(baseUrl).request(path, { method: 'POST', json: reason })).status).toBe(401);
    expect((await rail.engineer.request(path, { method: 'POST', json: reason })).status).toBe(403);
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    expect((await other.request(path, { method: 'POST', json: reason })).status).toBe(404);
    const blank = await rail.client.request(path, { method: 'POST', json: { reason: '   ' } });
    expect(blank.status).toBe(400);
    expect((await blank.json()).issues[0]).toMatchObject({ path: 'reason' });
    expect(await quoteState(rail.client, rail.quote.id)).toBe('sent');
  });

  test('the quote ends declined, the brief returns to review and the engineer is e-mailed exactly once', async () => {
    const rail = await sentQuote();
    await rail.send();
    const declined = await rail.client.request(`/api/v1/quotes/${rail.quote.id}/decline`, {
      method: 'POST',
      json: { reason: 'Over our budget for this run.\nA cheaper linear option would do.' },
    });
    expect(declined.status).toBe(200);
    expect(await declined.json()).toMatchObject({
      state: 'declined',
      declineReason: 'Over our budget for this run.\nA cheaper linear option would do.',
    });
    expect((await (await rail.client.request(`/api/v1/briefs/${rail.briefId}`)).json()).state).toBe('in-review');

    // Neither decision can follow a decline.
    const again = await rail.client.request(`/api/v1/quotes/${rail.quote.id}/decline`, { method: 'POST', json: { reason: 'x' } });
    expect(again.status).toBe(409);
    expect((await again.json()).message).toContain('declined already');
    expect((await rail.client.request(`/api/v1/quotes/${rail.quote.id}/accept`, { method: 'POST' })).status).toBe(409);

    const subject = `Quote ${rail.quote.number} declined: ${rail.quote.briefTitle}`;
    const mail = await until(
      async () => (await mailsTo(mailApiUrl, DEMO.engineer)).filter((m) => m.subject === subject),
      (found) => found.length > 0,
      'the decline e-mail',
    );
    const full = await mailText(mailApiUrl, mail[0]?.id);
    expect(full).toContain('A cheaper linear option would do.');
    expect(full).toContain(`/desk/briefs/${rail.briefId}`);
    const outbox = await execSql(databaseUrl, "SELECT state FROM mail_outbox WHERE related_id = ? AND kind = 'quote-declined'", [
      rail.quote.id,
    ]);
    expect(outbox).toEqual([{ state: 'sent' }]);
    // The outbox poller runs every few seconds: the mail must not go out a second time.
    await new Promise((r) => setTimeout(r, 6_000));
    expect((await mailsTo(mailApiUrl, DEMO.engineer)).filter((m) => m.subject === subject)).toHaveLength(1);

    // The record says who declined and why.
    const moves = await execSql(databaseUrl, "SELECT to_state, note FROM state_change WHERE subject_id = ? AND to_state = 'declined'", [
      rail.quote.id,
    ]);
    expect(moves).toEqual([{ to_state: 'declined', note: 'Over our budget for this run.\nA cheaper linear option would do.' }]);
    const page = await (await rail.client.request(`/quotes/${rail.quote.id}`)).text();
    expect(page).toContain('A cheaper linear option would do.');
    expect(page).toContain('No deposit is taken on a declined quote.');
    expect(page).not.toContain('?confirm=accept');
  });

  test('an expired quote cannot be declined', async () => {
    const rail = await sentQuote();
    await rail.send();
    await execSql(databaseUrl, 'UPDATE quote SET valid_until = ? WHERE id = ?', [Date.now() - 60_000, rail.quote.id]);
    const late = await rail.client.request(`/api/v1/quotes/${rail.quote.id}/decline`, { method: 'POST', json: { reason: 'Too late' } });
    expect(late.status).toBe(409);
    expect((await late.json()).message).toContain('expired');
  });

  test('the page’s confirming step declines; a missing reason keeps the step with its error', async () => {
    const rail = await sentQuote();
    await rail.send();
    const confirming = await (await rail.client.request(`/quotes/${rail.quote.id}?confirm=decline`)).text();
    expect(confirming).toContain(`Decline quote ${rail.quote.number}?`);

    const blank = await formPost(rail.client, `/quotes/${rail.quote.id}`, { decision: 'decline', reason: '' });
    expect(blank.status).toBe(400);
    const shown = await blank.text();
    expect(shown).toContain('name="reason"');
    expect(shown).toContain('Tell us why you are declining');

    const posted = await formPost(rail.client, `/quotes/${rail.quote.id}`, { decision: 'decline', reason: 'Project cancelled.' });
    expect(posted.status).toBe(303);
    expect(posted.headers.get('location')).toBe(`/quotes/${rail.quote.id}?done=declined`);
    expect(await quoteState(rail.client, rail.quote.id)).toBe('declined');
  });
});
