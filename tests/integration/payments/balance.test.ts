/**
 * The balance, with the real stripe SDK against the stand-in: delivering the
 * design issues the invoice and mails it once; the client pays it through a
 * signed webhook; the brief ends paid in full with a receipt; money taken twice
 * goes back.
 */
import { eq } from 'drizzle-orm';
import { describe, expect, inject, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { payment } from '../../../src/lib/platform/db/schema';
import { SUCCESS_CARD } from '../../../stripe-fake/index';
import { DEMO, Visitor } from '../../support/client';
import { pdfText, railUnderReview } from '../quotes/helpers';
import { completedEvent, mailSubjects, openCheckout, pay, redeliver, stripe, until } from './helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const databaseUrl = inject('databaseUrl');

interface InvoiceJson {
  id: string;
  number: string;
  state: string;
  netMinor: number;
  taxMinor: number;
  grossMinor: number;
  depositPaidMinor: number;
  balanceMinor: number;
  purchaseOrder: string | null;
}

const briefState = async (visitor: Visitor, id: string) => (await (await visitor.request(`/api/v1/briefs/${id}`)).json()).state as string;
const invoiceOf = async (visitor: Visitor, quoteId: string) =>
  (await (await visitor.request(`/api/v1/quotes/${quoteId}`)).json()).invoice as InvoiceJson | null;

/** A job with its deposit paid and its design in hand: the client gave a billing address and a PO. */
async function jobInDesign() {
  const rail = await railUnderReview(baseUrl);
  const saved = await rail.client.form('/account/billing', { billingAddress: 'Lindqvist Telemetry\nKanalgatan 9\nVästerholm' });
  expect(saved.status).toBe(303);
  expect(await (await rail.client.follow(saved)).text()).toContain('Billing address saved');
  expect(await (await rail.client.request('/account')).text()).toContain('Kanalgatan 9');
  const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
  expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
  const accepted = await rail.client.request(`/api/v1/quotes/${quote.id}/accept`, {
    method: 'POST',
    json: { purchaseOrder: 'LT-PO-4471' },
  });
  expect(accepted.status).toBe(200);
  const deposit = await openCheckout(rail.client, quote.id);
  expect((await pay(deposit.url, SUCCESS_CARD)).status).toBe(303);
  await until(
    () => briefState(rail.client, rail.briefId),
    (s) => s === 'deposit-paid',
    'the deposit',
  );
  const move = (to: string) => rail.engineer.request(`/api/v1/briefs/${rail.briefId}`, { method: 'PATCH', json: { state: to } });
  expect((await move('in-design')).status).toBe(200);
  return { ...rail, move, quote: quote as { id: string; number: string; totalMinor: number; depositMinor: number; currency: string } };
}

async function invoiceMails(email: string) {
  return (await mailSubjects(email)).filter((s) => s.startsWith('Invoice INV-'));
}

describe('the balance invoice', () => {
  test('delivering the design issues the invoice once, with the deposit deducted, and mails its PDF once', async () => {
    const job = await jobInDesign();
    expect(await invoiceOf(job.client, job.quote.id)).toBeNull();
    // The client cannot mark delivery: their edits name no such state.
    expect((await job.client.request(`/api/v1/briefs/${job.briefId}`, { method: 'PATCH', json: { state: 'delivered' } })).status).toBe(400);

    expect((await job.move('delivered')).status).toBe(200);
    const invoice = await invoiceOf(job.client, job.quote.id);
    expect(invoice).toMatchObject({ state: 'issued', purchaseOrder: 'LT-PO-4471', depositPaidMinor: job.quote.depositMinor });
    expect(invoice?.number).toMatch(new RegExp(`^INV-${new Date().getUTCFullYear()}-\\d{4}$`));
    expect(invoice?.grossMinor).toBe(job.quote.totalMinor);
    expect(invoice?.balanceMinor).toBe(job.quote.totalMinor - job.quote.depositMinor);
    expect((invoice?.netMinor ?? 0) + (invoice?.taxMinor ?? 0)).toBe(invoice?.grossMinor);
    // The client's brief page names the invoice and where to pay it.
    const briefPage = await (await job.client.request(`/briefs/${job.briefId}`)).text();
    expect(briefPage).toContain(`Invoice ${invoice?.number}: balance of`);
    expect(briefPage).toContain('pay it on the quote page');

    // A second "delivered" changes nothing: the brief has moved on, and no second invoice or mail follows.
    expect((await job.move('delivered')).status).toBe(409);
    const mails = await until(
      () => invoiceMails(job.email),
      (list) => list.length > 0,
      'the invoice mail',
    );
    await new Promise((r) => setTimeout(r, 500));
    expect(await invoiceMails(job.email)).toEqual(mails);
    expect(mails).toHaveLength(1);
    expect(mails[0]).toContain(invoice?.number ?? '?');

    const listed = (await (await fetch(`${mailApiUrl}/messages?to=${encodeURIComponent(job.email)}`)).json()) as {
      subject: string;
      attachments: { filename: string; contentType: string }[];
    }[];
    const mailed = listed.find((m) => m.subject.startsWith('Invoice INV-'));
    expect(mailed?.attachments).toEqual([
      expect.objectContaining({ filename: `Railwright-invoice-${invoice?.number}.pdf`, contentType: 'application/pdf' }),
    ]);

    const pdf = await job.client.request(`/api/v1/invoices/${invoice?.id}/pdf?download`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get('content-disposition')).toContain(`attachment; filename="Railwright-invoice-${invoice?.number}.pdf"`);
    const text = pdfText(new Uint8Array(await pdf.arrayBuffer()));
    for (const expected of [invoice?.number ?? '?', 'LT-PO-4471', 'Kanalgatan 9', 'Västerholm', 'Deposit paid', 'Balance due'])
      expect(text).toContain(expected);
    // The demo rate card's identifiers, printed under the letterhead.
    expect(text).toContain('Company registration 08812734');
    expect(text).toContain('VAT / tax id EU372918455');
  });

  test('delivered from the review page, the invoice is seen only by the client whose brief it is and staff; only that client pays it', async () => {
    const job = await jobInDesign();
    const marked = await job.engineer.form(`/desk/briefs/${job.briefId}`, { intent: 'move', state: 'delivered', note: 'Design pack sent' });
    expect(marked.status).toBe(303);
    expect(await briefState(job.client, job.briefId)).toBe('delivered');
    const invoice = await invoiceOf(job.engineer, job.quote.id);
    const id = invoice?.id ?? '?';
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    const anonymous = new Visitor(baseUrl);
    for (const path of [`/api/v1/invoices/${id}`, `/api/v1/invoices/${id}/pdf`]) {
      expect((await job.client.request(path)).status).toBe(200);
      expect((await job.engineer.request(path)).status).toBe(200);
      expect((await other.request(path)).status).toBe(404);
      expect((await anonymous.request(path)).status).toBe(401);
    }
    const checkout = `/api/v1/invoices/${id}/checkout`;
    expect((await anonymous.request(checkout, { method: 'POST' })).status).toBe(401);
    expect((await job.engineer.request(checkout, { method: 'POST' })).status).toBe(403);
    expect((await other.request(checkout, { method: 'POST' })).status).toBe(404);
    expect((await job.client.request(checkout, { method: 'POST' })).status).toBe(200);
  });

  test('the balance paid through the signed webhook settles the invoice, ends the brief paid in full, and a receipt with the PO follows once', async () => {
    const job = await jobInDesign();
    expect((await job.move('delivered')).status).toBe(200);
    const invoice = (await invoiceOf(job.client, job.quote.id)) as InvoiceJson;
    const opened = await job.client.request(`/api/v1/invoices/${invoice.id}/checkout`, { method: 'POST' });
    expect(opened.status).toBe(200);
    const { url } = (await opened.json()) as { url: string };
    const sessionId = new URL(url).pathname.split('/').pop() ?? '';
    const session = await stripe.checkout.sessions.retrieve(sessionId);
    expect(session.amount_total).toBe(invoice.balanceMinor);
    expect(session.success_url).toContain(`/quotes/${job.quote.id}?balance=returned`);
    // A second click reuses the open session.
    expect((await (await job.client.request(`/api/v1/invoices/${invoice.id}/checkout`, { method: 'POST' })).json()).url).toBe(url);

    expect((await pay(url, SUCCESS_CARD)).status).toBe(303);
    await until(
      () => briefState(job.client, job.briefId),
      (s) => s === 'paid-in-full',
      'the brief to be paid in full',
    );
    expect(await invoiceOf(job.client, job.quote.id)).toMatchObject({ state: 'paid' });
    const history = (await (await job.client.request(`/api/v1/briefs/${job.briefId}`)).json()).history as { from: string; to: string }[];
    expect(history.at(-1)).toMatchObject({ from: 'delivered', to: 'paid-in-full' });

    const receipts = await until(
      () => mailSubjects(job.email),
      (list) => list.some((s) => s.startsWith('Receipt: balance')),
      'the balance receipt',
    );
    expect(receipts.filter((s) => s.startsWith('Receipt: balance'))).toEqual([expect.stringContaining(invoice.number)]);
    const listed = (await (await fetch(`${mailApiUrl}/messages?to=${encodeURIComponent(job.email)}`)).json()) as {
      id: string;
      subject: string;
    }[];
    const receipt = listed.find((m) => m.subject.startsWith('Receipt: balance'));
    const body = (await (await fetch(`${mailApiUrl}/messages/${receipt?.id}`)).json()) as { text: string };
    expect(body.text).toContain('Your PO:       LT-PO-4471');
    // The engineer who drafted the quote hears of it too.
    const notices = await until(
      () => mailSubjects(DEMO.engineer),
      (list) => list.some((s) => s.startsWith(`Balance paid: quote ${job.quote.number}`)),
      'the engineer’s notice',
    );
    expect(notices.filter((s) => s.startsWith(`Balance paid: quote ${job.quote.number}`))).toHaveLength(1);

    // The provider's event delivered again records nothing twice and mails nothing more.
    const delivery = await completedEvent(sessionId);
    await redeliver(delivery?.id ?? '?');
    await new Promise((r) => setTimeout(r, 800));
    expect((await mailSubjects(job.email)).filter((s) => s.startsWith('Receipt: balance'))).toHaveLength(1);
    const again = await job.client.request(`/api/v1/invoices/${invoice.id}/checkout`, { method: 'POST' });
    expect(again.status).toBe(409);
    expect((await again.json()).message).toContain('paid already');
  });

  test('a second balance payment for a paid invoice is refunded in full and recorded', async () => {
    const job = await jobInDesign();
    expect((await job.move('delivered')).status).toBe(200);
    const invoice = (await invoiceOf(job.client, job.quote.id)) as InvoiceJson;
    const { url } = (await (await job.client.request(`/api/v1/invoices/${invoice.id}/checkout`, { method: 'POST' })).json()) as {
      url: string;
    };
    expect((await pay(url, SUCCESS_CARD)).status).toBe(303);
    await until(
      () => briefState(job.client, job.briefId),
      (s) => s === 'paid-in-full',
      'the brief to be paid in full',
    );
    const { db, client } = connect(databaseUrl);
    try {
      // A page for the same balance, opened in another tab before the first was paid, is paid afterwards.
      const stray = await stripe.checkout.sessions.create({
        mode: 'payment',
        line_items: [
          {
            quantity: 1,
            price_data: { currency: job.quote.currency.toLowerCase(), unit_amount: invoice.balanceMinor, product_data: { name: 'stray' } },
          },
        ],
        success_url: `${baseUrl}/`,
        cancel_url: `${baseUrl}/`,
      });
      await db.insert(payment).values({
        quoteId: job.quote.id,
        kind: 'balance',
        checkoutSessionId: stray.id,
        amountMinor: invoice.balanceMinor,
        currency: job.quote.currency,
        state: 'pending',
      });
      expect((await pay(stray.url ?? '', SUCCESS_CARD)).status).toBe(303);
      const rows = await until(
        () => db.select().from(payment).where(eq(payment.quoteId, job.quote.id)).orderBy(payment.createdAt),
        (list) => list.some((p) => p.kind === 'refund'),
        'the refund',
      );
      expect(
        rows
          .filter((p) => p.kind === 'balance')
          .map((p) => p.state)
          .sort(),
      ).toEqual(['paid', 'refunded']);
      expect(rows.find((p) => p.kind === 'refund')).toMatchObject({ amountMinor: invoice.balanceMinor, state: 'paid' });
    } finally {
      client.close();
    }
    const refundNotice = await until(
      () => mailSubjects(job.email),
      (list) => list.some((s) => s.startsWith('Refund:')),
      'the refund notice',
    );
    expect(refundNotice.filter((s) => s.startsWith('Receipt: balance'))).toHaveLength(1);
    // The quote page tells of it beside the invoice, not under the deposit.
    const page = await (await job.client.request(`/quotes/${job.quote.id}`)).text();
    expect(page).toContain('could not count as the balance was refunded in full');
    expect(page).not.toContain('could not count as the deposit');
  });
});
