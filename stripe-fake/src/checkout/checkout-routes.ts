import type { IncomingMessage, ServerResponse } from 'node:http';
import { payWithCard, DECLINE_MESSAGE } from './card-payments.ts';
import { successRedirect } from './checkout-sessions.ts';
import type { EventOrigin } from '../webhooks/event-log.ts';
import { checkoutPage, closedSessionPage, paidPage, unknownSessionPage } from './hosted-page.ts';
import { readBody, redirect, sendHtml } from '../http-io.ts';
import type { SessionRecord } from '../objects.ts';
import type { FakeServices } from '../services.ts';

const FORM_LIMIT_BYTES = 16 * 1024;

function hostedOrigin(record: SessionRecord): EventOrigin {
  // Events caused by the payer on the hosted page carry no API request, as in the real service.
  return { apiVersion: record.apiVersion, requestId: null, idempotencyKey: null };
}

function showClosed(response: ServerResponse, record: SessionRecord, status: number): void {
  sendHtml(response, status, closedSessionPage(record, successRedirect(record.session)));
}

async function pay(services: FakeServices, request: IncomingMessage, response: ServerResponse, record: SessionRecord): Promise<void> {
  const form = new URLSearchParams(await readBody(request, FORM_LIMIT_BYTES));
  // Checked after the body has arrived: a second pay posted meanwhile must not charge again.
  if (record.session.status !== 'open') {
    showClosed(response, record, 409);
    return;
  }
  const outcome = payWithCard(services.state, record, form.get('card_number') ?? '');
  if (outcome.kind === 'refused') {
    sendHtml(response, 400, checkoutPage(record, outcome.message));
    return;
  }
  const origin = hostedOrigin(record);
  if (outcome.kind === 'declined') {
    services.events.publish('payment_intent.payment_failed', outcome.paymentIntent, origin);
    sendHtml(response, 402, checkoutPage(record, DECLINE_MESSAGE));
    return;
  }
  services.events.publish('payment_intent.succeeded', outcome.paymentIntent, origin);
  services.events.publish('checkout.session.completed', record.session, origin);
  const location = successRedirect(record.session);
  if (location) redirect(response, location);
  else sendHtml(response, 200, paidPage(record));
}

/** The hosted checkout page: `GET /checkout/:id` shows it, `POST /checkout/:id/pay` takes the card. */
export async function handleCheckout(
  services: FakeServices,
  request: IncomingMessage,
  response: ServerResponse,
  path: string,
): Promise<void> {
  const match = /^\/checkout\/([^/]+)(\/pay)?$/.exec(path);
  const sessionId = match?.[1] ?? '';
  const record = services.state.sessions.get(sessionId);
  if (!match || !record) {
    sendHtml(response, 404, unknownSessionPage(sessionId || path));
    return;
  }
  const isPay = match[2] !== undefined;
  if (isPay && request.method === 'POST') {
    await pay(services, request, response, record);
    return;
  }
  if (!isPay && (request.method === 'GET' || request.method === 'HEAD')) {
    if (record.session.status === 'open') sendHtml(response, 200, checkoutPage(record));
    else showClosed(response, record, record.session.status === 'expired' ? 410 : 200);
    return;
  }
  response.writeHead(405, { allow: isPay ? 'POST' : 'GET', 'content-type': 'text/plain; charset=utf-8' });
  response.end(isPay ? 'Pay by posting the form on the checkout page.' : 'The checkout page is read with GET.');
}
