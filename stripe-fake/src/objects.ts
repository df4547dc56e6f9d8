/** The API objects the stand-in keeps, shaped like the real ones for the fields it implements. */

export type Metadata = Record<string, string>;

export interface Price {
  id: string;
  object: 'price';
  active: boolean;
  created: number;
  currency: string;
  livemode: false;
  product: string;
  type: 'one_time';
  unit_amount: number;
}

export interface LineItem {
  id: string;
  object: 'item';
  amount_discount: number;
  amount_subtotal: number;
  amount_tax: number;
  amount_total: number;
  currency: string;
  description: string;
  quantity: number;
  price: Price;
}

export interface CheckoutSession {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer: null;
  customer_details: { email: string | null; name: string | null } | null;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  metadata: Metadata;
  mode: 'payment';
  payment_intent: string | null;
  payment_method_types: string[];
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  success_url: string | null;
  url: string | null;
}

export interface PaymentError {
  type: 'card_error';
  code: 'card_declined';
  decline_code: 'generic_decline';
  message: string;
}

export interface PaymentIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  canceled_at: number | null;
  created: number;
  currency: string;
  description: string | null;
  last_payment_error: PaymentError | null;
  latest_charge: string | null;
  livemode: false;
  metadata: Metadata;
  payment_method_types: string[];
  status: 'requires_payment_method' | 'succeeded' | 'canceled';
}

export interface Refund {
  id: string;
  object: 'refund';
  amount: number;
  charge: string | null;
  created: number;
  currency: string;
  metadata: Metadata;
  payment_intent: string;
  reason: string | null;
  status: 'succeeded';
}

export interface ApiEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: unknown };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

/** What the stand-in keeps about a checkout session beyond the object it answers with. */
export interface SessionRecord {
  session: CheckoutSession;
  lineItems: LineItem[];
  paymentIntentData: { metadata: Metadata; description: string | null };
  /** The API version the session was created with; its events are rendered in it. */
  apiVersion: string;
}
