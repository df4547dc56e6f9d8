/**
 * An accepted quote is paid within its validity. Past it with no deposit, the
 * quote expires, the brief goes back to review and the engineer sends a fresh
 * quote; a checkout opened just before the end still completes.
 */
import { describe, expect, inject, test } from 'vitest';
import { SUCCESS_CARD } from '../../../stripe-fake/index';
import { execSql } from '../quotes/helpers';
import { acceptedQuote, openCheckout, pay, quoteState, until } from './helpers';

const databaseUrl = inject('databaseUrl');

const lapse = (quoteId: string) => execSql(databaseUrl, 'UPDATE quote SET valid_until = ? WHERE id = ?', [Date.now() - 60_000, quoteId]);

describe('an accepted quote past its validity', () => {
  test('with no deposit it expires, the brief returns to review, no payment is offered, and a fresh quote can be sent and paid', async () => {
    const rail = await acceptedQuote();
    await lapse(rail.quote.id);

    const page = await (await rail.client.request(`/quotes/${rail.quote.id}`)).text();
    expect(page).not.toContain('Pay the deposit');
    expect(await quoteState(rail.client, rail.quote.id)).toBe('expired');
    const brief = await (await rail.client.request(`/api/v1/briefs/${rail.briefId}`)).json();
    expect(brief.state).toBe('in-review');
    expect(brief.history.at(-1)).toMatchObject({ from: 'accepted', to: 'in-review' });
    expect((await rail.client.request(`/api/v1/quotes/${rail.quote.id}/checkout`, { method: 'POST' })).status).toBe(409);

    const drafted = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } });
    expect(drafted.status).toBe(201);
    const fresh = (await drafted.json()) as { id: string };
    expect((await rail.engineer.request(`/api/v1/quotes/${fresh.id}/send`, { method: 'POST' })).status).toBe(200);
    expect((await rail.client.request(`/api/v1/quotes/${fresh.id}/accept`, { method: 'POST' })).status).toBe(200);
    const { url } = await openCheckout(rail.client, fresh.id);
    await pay(url, SUCCESS_CARD);
    await until(
      () => quoteState(rail.client, fresh.id),
      (s) => s === 'deposit-paid',
      'the fresh quote to be paid',
    );
  });

  test('with a checkout opened before the end it waits: no new payment is offered, and the open checkout still completes', async () => {
    const rail = await acceptedQuote();
    const { url } = await openCheckout(rail.client, rail.quote.id);
    await lapse(rail.quote.id);

    const page = await (await rail.client.request(`/quotes/${rail.quote.id}`)).text();
    expect(page).not.toContain('Pay the deposit');
    expect(await quoteState(rail.client, rail.quote.id)).toBe('accepted');
    expect((await rail.client.request(`/api/v1/quotes/${rail.quote.id}/checkout`, { method: 'POST' })).status).toBe(409);

    await pay(url, SUCCESS_CARD);
    await until(
      () => quoteState(rail.client, rail.quote.id),
      (s) => s === 'deposit-paid',
      'the deposit to be paid',
    );
  });
});
