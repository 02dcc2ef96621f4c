// Object shapes the fake returns, trimmed to the fields the app and the SDK read
// (docs.stripe.com/api/checkout/sessions/object, /api/events/object, /api/refunds/object).
export type Metadata = Record<string, string>;

export type Price = {
  id: string;
  object: 'price';
  currency: string;
  product: string;
  type: 'one_time';
  unit_amount: number;
  /** A string: SDK 23 coerces `decimal_string` fields into its Decimal type. */
  unit_amount_decimal: string;
};

export type LineItem = {
  id: string;
  object: 'item';
  description: string;
  quantity: number;
  amount_subtotal: number;
  amount_discount: number;
  amount_tax: number;
  amount_total: number;
  currency: string;
  price: Price;
};

export type CheckoutSession = {
  id: string;
  object: 'checkout.session';
  mode: 'payment';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid' | 'no_payment_required';
  url: string | null;
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  customer_email: string | null;
  customer_details: { email: string | null; name: string | null } | null;
  metadata: Metadata;
  client_reference_id: string | null;
  payment_intent: string | null;
  success_url: string | null;
  cancel_url: string | null;
  created: number;
  expires_at: number;
  livemode: false;
  ui_mode: 'hosted';
};

export type PaymentIntent = {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  status: 'succeeded';
  latest_charge: string;
  metadata: Metadata;
  created: number;
  livemode: false;
  payment_method_types: ['card'];
};

export type Charge = {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  refunded: boolean;
  captured: true;
  paid: true;
  status: 'succeeded';
  currency: string;
  payment_intent: string;
  metadata: Metadata;
  billing_details: { email: string | null; name: string | null };
  created: number;
  livemode: false;
};

export type Refund = {
  id: string;
  object: 'refund';
  amount: number;
  currency: string;
  charge: string;
  payment_intent: string;
  reason: 'duplicate' | 'fraudulent' | 'requested_by_customer' | null;
  status: 'succeeded';
  metadata: Metadata;
  created: number;
};

export type StripeObject = CheckoutSession | PaymentIntent | Charge | Refund;

export type StripeEvent = {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
  data: { object: StripeObject };
};

/** Who caused an event: an API request (id + key) or the hosted page / a test hook (both null). */
export type RequestRef = StripeEvent['request'];

/** `copy` is 2 for the duplicate sent when `deliverTwice` is on; `attempt` counts retries within a copy. */
export type DeliveryAttempt = { copy: number; attempt: number; at: string; status: number | null; error?: string };

export type EventRecord = {
  event: StripeEvent;
  /** Groups events for `reverseOrder`: the Checkout Session the object belongs to. */
  sessionId: string | null;
  state: 'held' | 'pending' | 'delivered' | 'failed';
  attempts: DeliveryAttempt[];
};

export type FakeConfig = {
  deliverTwice: boolean;
  reverseOrder: boolean;
  /** The next N `/v1` requests answer 500 `api_error` before any work (nothing is stored for their keys). */
  failNext: number;
  /** Extra delay inside each `/v1` handler, e.g. to make two requests with one key overlap (409). */
  latencyMs: number;
};

export const defaultConfig = (): FakeConfig => ({
  deliverTwice: false,
  reverseOrder: false,
  failNext: 0,
  latencyMs: 0,
});
