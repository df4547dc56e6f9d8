/**
 * The notice e-mails: "brief received" to the client, quote accepted and deposit paid to the
 * engineer who drafted the quote, each once and with its page's link; and a person's choice on
 * the account page to turn a kind off, which the outbox keeps.
 */
import { describe, expect, inject, test } from 'vitest';
import { SUCCESS_CARD } from '../../../stripe-fake/index';
import { DEMO } from '../../support/client';
import { openCheckout, pay, until } from '../payments/helpers';
import { mailsTo, mailText, railUnderReview } from '../quotes/helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');

const subjectsTo = async (to: string, start: string) => (await mailsTo(mailApiUrl, to)).filter((m) => m.subject.startsWith(start));
const settled = () => new Promise((r) => setTimeout(r, 6_000));

describe('notice e-mails', () => {
  test('brief received, quote accepted and deposit paid: each once, to the right person, with the link', async () => {
    const rail = await railUnderReview(baseUrl);
    const received = await until(
      () => subjectsTo(rail.email, 'We received your brief'),
      (m) => m.length > 0,
      'brief received',
    );
    expect(await mailText(mailApiUrl, received[0]?.id)).toContain(`/briefs/${rail.briefId}`);

    const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    await rail.client.request(`/api/v1/quotes/${quote.id}/accept`, { method: 'POST', json: { purchaseOrder: 'PO-5521' } });
    const accepted = await until(
      () => subjectsTo(DEMO.engineer, `Quote ${quote.number} accepted`),
      (m) => m.length > 0,
      'accepted',
    );
    const acceptedText = await mailText(mailApiUrl, accepted[0]?.id);
    expect(acceptedText).toContain('PO-5521');
    expect(acceptedText).toContain(`/quotes/${quote.id}`);

    const { url } = await openCheckout(rail.client, quote.id);
    await pay(url, SUCCESS_CARD);
    const paid = await until(
      () => subjectsTo(DEMO.engineer, `Deposit paid: quote ${quote.number}`),
      (m) => m.length > 0,
      'deposit paid',
    );
    expect(await mailText(mailApiUrl, paid[0]?.id)).toContain(`/desk/briefs/${rail.briefId}`);

    await settled();
    expect(await subjectsTo(rail.email, 'We received your brief')).toHaveLength(1);
    expect(await subjectsTo(DEMO.engineer, `Quote ${quote.number} accepted`)).toHaveLength(1);
    expect(await subjectsTo(DEMO.engineer, `Deposit paid: quote ${quote.number}`)).toHaveLength(1);
  });

  test('a kind turned off on the account page is not sent; the others still are', async () => {
    const rail = await railUnderReview(baseUrl);
    const page = await (await rail.client.request('/account')).text();
    expect(page).toContain('name="brief-message" checked');
    expect(page).not.toContain('name="quote-accepted"'); // an engineer's kind is not offered to a client

    // Everything ticked but messages.
    const saved = await rail.client.form('/account', { 'brief-received': 'on', 'brief-changes-requested': 'on' });
    expect(saved.status).toBe(303);
    expect(await (await rail.client.request('/account')).text()).not.toContain('name="brief-message" checked');

    await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/messages`, { method: 'POST', json: { body: 'A question for you.' } });
    await rail.engineer.request(`/api/v1/briefs/${rail.briefId}`, {
      method: 'PATCH',
      json: { state: 'changes-requested', note: 'Please give the load step.' },
    });
    await until(
      () => subjectsTo(rail.email, 'Changes requested'),
      (m) => m.length > 0,
      'changes requested',
    );
    await settled();
    expect(await subjectsTo(rail.email, 'Message on')).toHaveLength(0);
  });
});
