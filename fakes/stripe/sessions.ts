// Checkout Sessions (docs.stripe.com/api/checkout/sessions/create and /object).
import { invalid, missingParam, newId, noSuch, nowSeconds } from './errors';
import { expandList, int, list, metadata, obj, requiredStr, str, type Params } from './params';
import type { StripeState } from './state';
import type { CheckoutSession, LineItem } from './types';

const MIN_EXPIRY_S = 30 * 60;
const MAX_EXPIRY_S = 24 * 60 * 60;

function lineItem(raw: Params[string], i: number): LineItem {
  const at = `line_items[${i}]`;
  const item = obj(raw, at) ?? {};
  const priceId = str(item.price, `${at}[price]`);
  // The fake has no Prices API: only inline `price_data` can describe what is sold.
  if (priceId) throw noSuch('price', priceId, `${at}[price]`);
  const quantity = int(item.quantity, `${at}[quantity]`, 1);
  if (quantity === undefined) throw missingParam(`${at}[quantity]`);
  const priceData = obj(item.price_data, `${at}[price_data]`);
  if (!priceData) throw missingParam(`${at}[price_data]`);
  const currency = requiredStr(priceData.currency, `${at}[price_data][currency]`).toLowerCase();
  if (!/^[a-z]{3}$/.test(currency)) throw invalid(`Invalid currency: ${currency}`, `${at}[price_data][currency]`);
  const decimal = str(priceData.unit_amount_decimal, `${at}[price_data][unit_amount_decimal]`);
  let unitAmount = int(priceData.unit_amount, `${at}[price_data][unit_amount]`);
  if (unitAmount === undefined && decimal !== undefined && /^\d+(\.\d{1,12})?$/.test(decimal))
    unitAmount = Number(decimal);
  if (unitAmount === undefined) throw missingParam(`${at}[price_data][unit_amount]`);
  const product = obj(priceData.product_data, `${at}[price_data][product_data]`);
  const productId = str(priceData.product, `${at}[price_data][product]`);
  if (productId) throw noSuch('product', productId, `${at}[price_data][product]`);
  const name = requiredStr(product?.name, `${at}[price_data][product_data][name]`);
  // Amounts are integer minor units, as in Stripe's API; a decimal unit price is rounded once, per line.
  const total = Math.round(unitAmount * quantity);
  return {
    id: newId('li_'),
    object: 'item',
    description: name,
    quantity,
    amount_subtotal: total,
    amount_discount: 0,
    amount_tax: 0,
    amount_total: total,
    currency,
    price: {
      id: newId('price_'),
      object: 'price',
      currency,
      product: newId('prod_', 14),
      type: 'one_time',
      unit_amount: Math.round(unitAmount),
      unit_amount_decimal: decimal ?? String(unitAmount),
    },
  };
}

function expiresAt(params: Params, created: number): number {
  const value = int(params.expires_at, 'expires_at');
  if (value === undefined) return created + MAX_EXPIRY_S;
  if (value < created + MIN_EXPIRY_S || value > created + MAX_EXPIRY_S) {
    throw invalid(
      'The `expires_at` timestamp must be between 30 minutes and 24 hours from Checkout Session creation.',
      'expires_at',
    );
  }
  return value;
}

/** Parameters the fake does not model (locale, payment_method_types, …) are accepted and ignored. */
export function createSession(state: StripeState, params: Params, publicUrl: string): CheckoutSession {
  const mode = requiredStr(params.mode, 'mode');
  if (mode !== 'payment') throw invalid('The local fake supports only mode=payment.', 'mode');
  const rawItems = list(params.line_items, 'line_items');
  if (rawItems.length === 0) throw missingParam('line_items');
  const items = rawItems.map(lineItem);
  const currency = items[0].currency;
  if (items.some((i) => i.currency !== currency))
    throw invalid('All line items must use the same currency.', 'line_items');
  const email = str(params.customer_email, 'customer_email') || null;
  if (email !== null && !/^[^@\s]+@[^@\s]+$/.test(email))
    throw invalid(`Invalid email address: ${email}`, 'customer_email', 'email_invalid');
  const reference = str(params.client_reference_id, 'client_reference_id') || null;
  if (reference !== null && reference.length > 200)
    throw invalid('client_reference_id is longer than 200 characters.', 'client_reference_id');
  const created = nowSeconds();
  const id = newId('cs_test_', 58);
  const total = items.reduce((sum, i) => sum + i.amount_total, 0);
  const session: CheckoutSession = {
    id,
    object: 'checkout.session',
    mode: 'payment',
    status: 'open',
    payment_status: 'unpaid',
    url: `${publicUrl}/pay/${id}`,
    amount_subtotal: total,
    amount_total: total,
    currency,
    customer_email: email,
    customer_details: null,
    metadata: metadata(params.metadata, 'metadata'),
    client_reference_id: reference,
    payment_intent: null,
    success_url: str(params.success_url, 'success_url') || null,
    cancel_url: str(params.cancel_url, 'cancel_url') || null,
    created,
    expires_at: expiresAt(params, created),
    livemode: false,
    ui_mode: 'hosted',
  };
  const piData = obj(params.payment_intent_data, 'payment_intent_data');
  state.sessions.set(id, session);
  state.lineItems.set(id, items);
  state.paymentIntentMetadata.set(id, metadata(piData?.metadata, 'payment_intent_data[metadata]'));
  return session;
}

/** `expand[]=line_items` / `payment_intent` as on docs.stripe.com/api/expanding_objects. */
export function sessionView(state: StripeState, session: CheckoutSession, params: Params): Record<string, unknown> {
  const view: Record<string, unknown> = structuredClone(session);
  for (const field of expandList(params)) {
    if (field === 'line_items') {
      const data = state.lineItems.get(session.id) ?? [];
      view.line_items = {
        object: 'list',
        data,
        has_more: false,
        url: `/v1/checkout/sessions/${session.id}/line_items`,
      };
    } else if (field === 'payment_intent') {
      view.payment_intent = session.payment_intent ? (state.paymentIntents.get(session.payment_intent) ?? null) : null;
    } else {
      throw invalid(`This property cannot be expanded (${field}).`, 'expand');
    }
  }
  return view;
}
