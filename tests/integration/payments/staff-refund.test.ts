/**
 * Staff give a paid deposit back through the payment stand-in: only staff, only with a reason,
 * once; recorded as a refund with who and why; the client is told once; the quote and brief stay put.
 */
import { eq } from 'drizzle-orm';
import { describe, expect, inject, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { payment } from '../../../src/lib/platform/db/schema';
import { DEMO, Visitor } from '../../support/client';
import { execSql, mailsTo, mailText } from '../quotes/helpers';
import { paidDepositQuote, quoteState, stripe, until } from './helpers';

const databaseUrl = inject('databaseUrl');
const mailApiUrl = inject('mailApiUrl');

async function paymentsOf(quoteId: string) {
  const { db, client } = connect(databaseUrl);
  try {
    return await db.select().from(payment).where(eq(payment.quoteId, quoteId)).orderBy(payment.createdAt);
  } finally {
    client.close();
  }
}

describe('a staff refund of a paid deposit', () => {
  test('staff only, with a reason, once; recorded with who and why; the client told once; nothing else moves', async () => {
    const rail = await paidDepositQuote();
    const [deposit] = await paymentsOf(rail.quote.id);
    const path = `/api/v1/payments/${deposit?.id}/refund`;

    expect((await rail.client.request(path, { method: 'POST', json: { reason: 'Give it back' } })).status).toBe(403);
    const blank = await rail.engineer.request(path, { method: 'POST', json: { reason: '  ' } });
    expect(blank.status).toBe(400);
    expect((await blank.json()).issues[0].path).toBe('reason');
    expect((await rail.engineer.request('/api/v1/payments/no-such-payment/refund', { method: 'POST', json: { reason: 'x' } })).status).toBe(
      404,
    );

    const refunded = await rail.engineer.request(path, {
      method: 'POST',
      json: { reason: 'The project was stopped by the client’s board.' },
    });
    expect(refunded.status).toBe(201);
    const refund = await refunded.json();
    expect(refund).toMatchObject({ kind: 'refund', state: 'paid', amountMinor: rail.quote.depositMinor, refundOf: deposit?.id });

    // The stand-in gave the money back: its refund is the refund row's reference.
    const rows = await paymentsOf(rail.quote.id);
    const refundRow = rows.find((r) => r.kind === 'refund');
    const providerRefund = await stripe.refunds.retrieve(refundRow?.checkoutSessionId ?? '');
    expect(providerRefund.amount).toBe(rail.quote.depositMinor);
    expect(providerRefund.payment_intent).toBe(deposit?.paymentIntentId);

    const [engineer] = await execSql(databaseUrl, 'SELECT id FROM user WHERE email = ?', [DEMO.engineer]);
    expect(rows.map((r) => [r.kind, r.state])).toEqual([
      ['deposit', 'refunded'],
      ['refund', 'paid'],
    ]);
    expect(refundRow).toMatchObject({ refundedBy: engineer?.id, refundReason: 'The project was stopped by the client’s board.' });

    // A second refund of the same payment is refused, and the provider is not asked twice.
    const again = await rail.engineer.request(path, { method: 'POST', json: { reason: 'Again' } });
    expect(again.status).toBe(409);
    expect(await paymentsOf(rail.quote.id)).toHaveLength(2);
    const admin = await new Visitor(inject('baseUrl')).signIn(DEMO.admin);
    expect((await admin.request(`/api/v1/payments/${refundRow?.id}/refund`, { method: 'POST', json: { reason: 'x' } })).status).toBe(409);

    // The quote and the brief stay where they were: what the work does next is a person's decision.
    expect(await quoteState(rail.client, rail.quote.id)).toBe('deposit-paid');
    expect((await (await rail.client.request(`/api/v1/briefs/${rail.briefId}`)).json()).state).toBe('deposit-paid');

    // The client's notice carries the reason, once, even after the outbox poller's turn.
    const notices = await until(
      async () => (await mailsTo(mailApiUrl, rail.email)).filter((m) => m.subject.startsWith('Refund:')),
      (found) => found.length > 0,
      'the refund notice',
    );
    expect(await mailText(mailApiUrl, notices[0]?.id)).toContain('Why: The project was stopped by the client’s board.');
    await new Promise((r) => setTimeout(r, 6_000));
    expect((await mailsTo(mailApiUrl, rail.email)).filter((m) => m.subject.startsWith('Refund:'))).toHaveLength(1);

    // The client's quote page says the deposit went back and why, and offers no payment.
    const clientPage = await (await rail.client.request(`/quotes/${rail.quote.id}`)).text();
    expect(clientPage).toContain('Your deposit was refunded in full; nothing is due on this quote now.');
    expect(clientPage).toContain('refunded to you in full');
    expect(clientPage).toContain('“The project was stopped by the client’s board.”');
    expect(clientPage).not.toContain('Pay the deposit');

    // The desk's payment list shows both, with kind, state, who and why.
    const desk = await (await rail.engineer.request(`/desk/quotes/${rail.quote.id}`)).text();
    expect(desk).toContain('Refunded');
    expect(desk).toContain('Given back');
    expect(desk).toContain('“The project was stopped by the client’s board.”');
    expect(desk).not.toContain('Refund the deposit');
  });

  test('the desk form refunds only with the tick, and only this quote’s payments', async () => {
    const rail = await paidDepositQuote();
    const [deposit] = await paymentsOf(rail.quote.id);
    const page = `/desk/quotes/${rail.quote.id}`;
    const form = (fields: Record<string, string>) =>
      rail.engineer.request(page, {
        method: 'POST',
        headers: { 'content-type': 'application/x-www-form-urlencoded' },
        body: new URLSearchParams(fields).toString(),
        redirect: 'manual',
      });
    expect(await (await rail.engineer.request(page)).text()).toContain('Refund the deposit of');

    const unticked = await form({ intent: 'refund', paymentId: deposit?.id ?? '', reason: 'Stopped' });
    expect(unticked.status).toBe(400);
    expect(await unticked.text()).toContain('Tick “Yes, refund” to confirm');
    const elsewhere = await form({ intent: 'refund', paymentId: 'another-quotes-payment', reason: 'Stopped', confirm: 'yes' });
    expect(elsewhere.status).toBe(404);
    expect((await paymentsOf(rail.quote.id)).map((r) => r.state)).toEqual(['paid']);

    const done = await form({ intent: 'refund', paymentId: deposit?.id ?? '', reason: 'Stopped', confirm: 'yes' });
    expect(done.status).toBe(303);
    expect(done.headers.get('location')).toContain('done=refunded');
    expect((await paymentsOf(rail.quote.id)).map((r) => [r.kind, r.state])).toEqual([
      ['deposit', 'refunded'],
      ['refund', 'paid'],
    ]);
  });
});
