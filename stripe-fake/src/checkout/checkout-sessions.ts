import { ApiError, invalidParam, missingParam } from '../api/api-error.ts';
import { isKnownCurrency } from '../currency.ts';
import {
  type Param,
  type ParamHash,
  optionalHash,
  optionalInteger,
  optionalList,
  optionalMetadata,
  optionalString,
  rejectUnknown,
  requiredString,
} from '../api/form-params.ts';
import { newId, unixNow } from '../ids.ts';
import type { CheckoutSession, LineItem, SessionRecord } from '../objects.ts';

const SESSION_PARAMS = [
  'mode',
  'line_items',
  'currency',
  'metadata',
  'success_url',
  'cancel_url',
  'customer_email',
  'client_reference_id',
  'payment_intent_data',
  'payment_method_types',
  'expand',
] as const;

// The API's own limits: eight digits of minor units per amount, a hundred line items per session.
const MAX_AMOUNT = 99_999_999;
const MAX_LINE_ITEMS = 100;
const SESSION_LIFETIME_SECONDS = 24 * 60 * 60;

function checkUrl(value: string | undefined, param: string): string | null {
  if (value === undefined) return null;
  // The `{CHECKOUT_SESSION_ID}` template is part of a valid URL; braces parse fine.
  let parsed: URL;
  try {
    parsed = new URL(value);
  } catch {
    throw invalidParam(param, `Not a valid URL: ${param} must be an absolute http(s) URL, got '${value}'.`, 'url_invalid');
  }
  if (parsed.protocol !== 'http:' && parsed.protocol !== 'https:') {
    throw invalidParam(param, `Not a valid URL: ${param} must use http or https, got '${value}'.`, 'url_invalid');
  }
  return value;
}

function readCurrency(value: Param | undefined, param: string): string {
  const currency = requiredString(value, param).toLowerCase();
  if (!/^[a-z]{3}$/.test(currency) || !isKnownCurrency(currency)) {
    throw invalidParam(param, `Invalid currency: ${currency}. Use a three-letter ISO 4217 code such as gbp, eur or usd.`);
  }
  return currency;
}

function readLineItem(value: Param, index: number, created: number): LineItem {
  const prefix = `line_items[${index}]`;
  const item = optionalHash(value, prefix) ?? {};
  if (item['price'] !== undefined) {
    throw invalidParam(
      `${prefix}[price]`,
      `The local payment stand-in keeps no Prices; describe the item with ${prefix}[price_data] instead.`,
    );
  }
  rejectUnknown(item, ['price_data', 'quantity'], prefix);
  const priceData = optionalHash(item['price_data'], `${prefix}[price_data]`);
  if (!priceData) throw missingParam(`${prefix}[price_data]`);
  rejectUnknown(priceData, ['currency', 'unit_amount', 'product_data'], `${prefix}[price_data]`);
  const currency = readCurrency(priceData['currency'], `${prefix}[price_data][currency]`);
  const unitAmount = optionalInteger(priceData['unit_amount'], `${prefix}[price_data][unit_amount]`, { min: 0, max: MAX_AMOUNT });
  if (unitAmount === undefined) throw missingParam(`${prefix}[price_data][unit_amount]`);
  const productData = optionalHash(priceData['product_data'], `${prefix}[price_data][product_data]`);
  if (!productData) throw missingParam(`${prefix}[price_data][product_data]`);
  rejectUnknown(productData, ['name'], `${prefix}[price_data][product_data]`);
  const name = requiredString(productData['name'], `${prefix}[price_data][product_data][name]`);
  const quantity = optionalInteger(item['quantity'], `${prefix}[quantity]`, { min: 1, max: 999_999 });
  if (quantity === undefined) throw missingParam(`${prefix}[quantity]`);
  const total = unitAmount * quantity;
  if (total > MAX_AMOUNT) {
    throw invalidParam(
      `${prefix}[quantity]`,
      `The amount of ${prefix} (${total}) is more than the largest amount the API accepts (${MAX_AMOUNT}).`,
    );
  }
  return {
    id: newId('li_'),
    object: 'item',
    amount_discount: 0,
    amount_subtotal: total,
    amount_tax: 0,
    amount_total: total,
    currency,
    description: name,
    quantity,
    price: {
      id: newId('price_'),
      object: 'price',
      // A price made from price_data exists only for this session, so it is inactive.
      active: false,
      created,
      currency,
      livemode: false,
      product: newId('prod_', 14),
      type: 'one_time',
      unit_amount: unitAmount,
    },
  };
}

function readLineItems(params: ParamHash, created: number): LineItem[] {
  const list = optionalList(params['line_items'], 'line_items');
  if (!list || list.length === 0) throw missingParam('line_items');
  if (list.length > MAX_LINE_ITEMS) {
    throw invalidParam('line_items', `A session can have at most ${MAX_LINE_ITEMS} line items (got ${list.length}).`);
  }
  const items = list.map((entry, index) => readLineItem(entry, index, created));
  const currency = items[0]?.currency;
  items.forEach((item, index) => {
    if (item.currency !== currency) {
      throw invalidParam(
        `line_items[${index}][price_data][currency]`,
        `All line items must have the same currency (line_items[0] is in ${currency}, line_items[${index}] in ${item.currency}).`,
      );
    }
  });
  return items;
}

function readPaymentMethodTypes(params: ParamHash): string[] {
  const list = optionalList(params['payment_method_types'], 'payment_method_types') ?? [];
  list.forEach((entry, index) => {
    const type = requiredString(entry, `payment_method_types[${index}]`);
    if (type !== 'card') {
      throw invalidParam(
        `payment_method_types[${index}]`,
        `The local payment stand-in takes cards only; payment method type '${type}' is not available.`,
      );
    }
  });
  return ['card'];
}

function readPaymentIntentData(params: ParamHash): SessionRecord['paymentIntentData'] {
  const data = optionalHash(params['payment_intent_data'], 'payment_intent_data') ?? {};
  rejectUnknown(data, ['metadata', 'description'], 'payment_intent_data');
  return {
    metadata: optionalMetadata(data['metadata'], 'payment_intent_data[metadata]') ?? {},
    description: optionalString(data['description'], 'payment_intent_data[description]') ?? null,
  };
}

function readEmail(params: ParamHash): string | null {
  const email = optionalString(params['customer_email'], 'customer_email');
  if (email === undefined) return null;
  if (!/^[^\s@]+@[^\s@]+$/.test(email)) {
    throw invalidParam('customer_email', `Invalid email address: ${email}`, 'email_invalid');
  }
  return email;
}

/** Validates a create request and builds the open session, the way the API does for payment mode. */
export function createSessionRecord(params: ParamHash, checkoutBaseUrl: string, apiVersion: string): SessionRecord {
  rejectUnknown(params, SESSION_PARAMS);
  const mode = requiredString(params['mode'], 'mode');
  if (mode !== 'payment') {
    throw invalidParam('mode', `The local payment stand-in supports mode=payment only, not '${mode}'.`);
  }
  const created = unixNow();
  const lineItems = readLineItems(params, created);
  const currency = lineItems[0]?.currency ?? '';
  const topCurrency = optionalString(params['currency'], 'currency');
  if (topCurrency !== undefined && topCurrency.toLowerCase() !== currency) {
    throw invalidParam('currency', `currency (${topCurrency}) does not match the line items' currency (${currency}).`);
  }
  const clientReferenceId = optionalString(params['client_reference_id'], 'client_reference_id') ?? null;
  if (clientReferenceId !== null && clientReferenceId.length > 200) {
    throw invalidParam(
      'client_reference_id',
      `client_reference_id can be at most 200 characters long (it has ${clientReferenceId.length}).`,
    );
  }
  const amount = lineItems.reduce((sum, item) => sum + item.amount_total, 0);
  if (amount > MAX_AMOUNT) {
    throw invalidParam('line_items', `The session's total (${amount}) is more than the largest amount the API accepts (${MAX_AMOUNT}).`);
  }
  const id = newId('cs_test_', 58);
  const session: CheckoutSession = {
    id,
    object: 'checkout.session',
    amount_subtotal: amount,
    amount_total: amount,
    cancel_url: checkUrl(optionalString(params['cancel_url'], 'cancel_url'), 'cancel_url'),
    client_reference_id: clientReferenceId,
    created,
    currency,
    customer: null,
    customer_details: null,
    customer_email: readEmail(params),
    expires_at: created + SESSION_LIFETIME_SECONDS,
    livemode: false,
    metadata: optionalMetadata(params['metadata'], 'metadata') ?? {},
    mode: 'payment',
    payment_intent: null,
    payment_method_types: readPaymentMethodTypes(params),
    payment_status: 'unpaid',
    status: 'open',
    success_url: checkUrl(optionalString(params['success_url'], 'success_url'), 'success_url'),
    url: `${checkoutBaseUrl}/checkout/${id}`,
  };
  return { session, lineItems, paymentIntentData: readPaymentIntentData(params), apiVersion };
}

/** The success URL with the session id in place of the `{CHECKOUT_SESSION_ID}` template. */
export function successRedirect(session: CheckoutSession): string | null {
  return session.success_url?.replaceAll('{CHECKOUT_SESSION_ID}', session.id) ?? null;
}

export function assertOpen(record: SessionRecord, action: string): void {
  const { status, id } = record.session;
  if (status !== 'open') {
    throw new ApiError(400, `Only Checkout Sessions with status "open" can be ${action}; ${id} is "${status}".`, {
      code: 'checkout_session_not_open',
    });
  }
}
