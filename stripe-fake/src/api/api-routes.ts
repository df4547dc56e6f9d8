import { ApiError, noSuchObject } from './api-error.ts';
import { expireSession } from '../checkout/card-payments.ts';
import { assertOpen, createSessionRecord } from '../checkout/checkout-sessions.ts';
import type { EventOrigin } from '../webhooks/event-log.ts';
import { type ParamHash, expansions, optionalInteger, optionalString, rejectUnknown } from './form-params.ts';
import type { LineItem, SessionRecord } from '../objects.ts';
import { createRefund } from '../checkout/refunds.ts';
import type { FakeServices } from '../services.ts';

interface ApiRequest {
  params: ParamHash;
  origin: EventOrigin;
  /** The path's captured ids, in order. */
  ids: string[];
}

interface ApiResult {
  status: number;
  body: unknown;
}

type Handler = (services: FakeServices, request: ApiRequest) => ApiResult;

interface Route {
  method: 'GET' | 'POST';
  pattern: RegExp;
  handler: Handler;
}

const SESSION_EXPANDABLE = ['payment_intent', 'line_items'] as const;

function sessionRecord(services: FakeServices, id: string): SessionRecord {
  const record = services.state.sessions.get(id);
  if (!record) throw noSuchObject('checkout.session', id, 'session');
  return record;
}

function lineItemList(record: SessionRecord, items: LineItem[], hasMore: boolean) {
  return {
    object: 'list',
    data: items,
    has_more: hasMore,
    url: `/v1/checkout/sessions/${record.session.id}/line_items`,
  };
}

function renderSession(services: FakeServices, record: SessionRecord, expand: Set<string>): Record<string, unknown> {
  const body: Record<string, unknown> = { ...record.session };
  if (expand.has('payment_intent') && record.session.payment_intent) {
    body['payment_intent'] = services.state.paymentIntents.get(record.session.payment_intent) ?? null;
  }
  if (expand.has('line_items')) body['line_items'] = lineItemList(record, record.lineItems, false);
  return body;
}

const createSession: Handler = (services, { params, origin }) => {
  const expand = expansions(params, SESSION_EXPANDABLE);
  const record = createSessionRecord(params, services.baseUrl, origin.apiVersion);
  services.state.sessions.set(record.session.id, record);
  return { status: 200, body: renderSession(services, record, expand) };
};

const retrieveSession: Handler = (services, { params, ids: [id = ''] }) => {
  rejectUnknown(params, ['expand']);
  const expand = expansions(params, SESSION_EXPANDABLE);
  return { status: 200, body: renderSession(services, sessionRecord(services, id), expand) };
};

const listSessionLineItems: Handler = (services, { params, ids: [id = ''] }) => {
  rejectUnknown(params, ['limit', 'starting_after']);
  const record = sessionRecord(services, id);
  const limit = optionalInteger(params['limit'], 'limit', { min: 1, max: 100 }) ?? 10;
  const after = optionalString(params['starting_after'], 'starting_after');
  let start = 0;
  if (after !== undefined) {
    const index = record.lineItems.findIndex((item) => item.id === after);
    if (index === -1) throw noSuchObject('line item', after, 'starting_after', 400);
    start = index + 1;
  }
  const page = record.lineItems.slice(start, start + limit);
  return { status: 200, body: lineItemList(record, page, start + limit < record.lineItems.length) };
};

const expire: Handler = (services, { params, origin, ids: [id = ''] }) => {
  rejectUnknown(params, ['expand']);
  const expand = expansions(params, SESSION_EXPANDABLE);
  const record = sessionRecord(services, id);
  assertOpen(record, 'expired');
  expireSession(services.state, record);
  services.events.publish('checkout.session.expired', record.session, origin);
  return { status: 200, body: renderSession(services, record, expand) };
};

const retrievePaymentIntent: Handler = (services, { params, ids: [id = ''] }) => {
  rejectUnknown(params, ['expand']);
  expansions(params, []);
  const intent = services.state.paymentIntents.get(id);
  if (!intent) throw noSuchObject('payment_intent', id, 'intent');
  return { status: 200, body: intent };
};

const refund: Handler = (services, { params, origin }) => {
  const created = createRefund(services.state, params);
  services.events.publish('refund.created', created, origin);
  return { status: 200, body: created };
};

const retrieveRefund: Handler = (services, { params, ids: [id = ''] }) => {
  rejectUnknown(params, ['expand']);
  expansions(params, []);
  const found = services.state.refunds.get(id);
  if (!found) throw noSuchObject('refund', id, 'id');
  return { status: 200, body: found };
};

const ID = '([^/]+)';
const ROUTES: Route[] = [
  { method: 'POST', pattern: /^\/v1\/checkout\/sessions$/, handler: createSession },
  { method: 'GET', pattern: new RegExp(`^/v1/checkout/sessions/${ID}$`), handler: retrieveSession },
  { method: 'GET', pattern: new RegExp(`^/v1/checkout/sessions/${ID}/line_items$`), handler: listSessionLineItems },
  { method: 'POST', pattern: new RegExp(`^/v1/checkout/sessions/${ID}/expire$`), handler: expire },
  { method: 'GET', pattern: new RegExp(`^/v1/payment_intents/${ID}$`), handler: retrievePaymentIntent },
  { method: 'POST', pattern: /^\/v1\/refunds$/, handler: refund },
  { method: 'GET', pattern: new RegExp(`^/v1/refunds/${ID}$`), handler: retrieveRefund },
];

export const SUPPORTED_CALLS = ROUTES.map(
  (route) => `${route.method} ${route.pattern.source.slice(1, -1).replaceAll('\\/', '/').replaceAll(ID, ':id')}`,
);

function decodeId(raw: string): string {
  try {
    return decodeURIComponent(raw);
  } catch {
    throw new ApiError(404, `The id '${raw}' in the request URL is not validly percent-encoded.`);
  }
}

/** The handler for an API call and the ids in its path, or a 404 naming what the stand-in implements. */
export function matchApiRoute(method: string, path: string): { handler: Handler; ids: string[] } {
  for (const route of ROUTES) {
    const match = route.method === method ? route.pattern.exec(path) : null;
    if (match) return { handler: route.handler, ids: match.slice(1).map(decodeId) };
  }
  throw new ApiError(
    404,
    `Unrecognized request URL (${method}: ${path}). The local payment stand-in implements: ${SUPPORTED_CALLS.join(', ')}.`,
  );
}
