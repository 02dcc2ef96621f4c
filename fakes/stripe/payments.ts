// Paying a session on the hosted page or through the test hook (test-hooks.ts), with Stripe's
// documented test cards (docs.stripe.com/testing): 4242… succeeds, 4000 0000 0000 0002 is declined.
import { ApiError, declined, invalid, newId, nowSeconds } from './errors';
import type { StripeState } from './state';
import type { Charge, CheckoutSession, PaymentIntent, RequestRef } from './types';

export const SUCCESS_CARD = '4242424242424242';
export const DECLINE_CARD = '4000000000000002';

export type Payer = { card?: string; name?: string; email?: string };

export function normaliseCard(card: string): string {
  return card.replace(/[\s-]/g, '');
}

function notOpen(session: CheckoutSession): ApiError {
  return invalid(
    `This Checkout Session is ${session.status} and can no longer be paid.`,
    undefined,
    'checkout_session_not_open',
  );
}

/** The success URL Stripe redirects to, with `{CHECKOUT_SESSION_ID}` filled in (docs.stripe.com/api/checkout/sessions/create, success_url). */
export function successUrl(session: CheckoutSession): string | null {
  return session.success_url?.replaceAll('{CHECKOUT_SESSION_ID}', session.id) ?? null;
}

/**
 * Throws an ApiError the caller can show: 402 declined (session stays open and unpaid),
 * 400 for a card that is not a test card or a session that is not open.
 */
export function paySession(state: StripeState, session: CheckoutSession, payer: Payer): CheckoutSession {
  if (session.status !== 'open') throw notOpen(session);
  const card = normaliseCard(payer.card ?? SUCCESS_CARD);
  if (card === DECLINE_CARD) throw declined();
  if (card !== SUCCESS_CARD)
    throw invalid(
      'Use a test card: 4242 4242 4242 4242 succeeds, 4000 0000 0000 0002 is declined.',
      'card',
      'invalid_number',
    );
  const created = nowSeconds();
  const metadata = state.paymentIntentMetadata.get(session.id) ?? {};
  const email = session.customer_email ?? (payer.email?.trim() || null);
  const name = payer.name?.trim() || null;
  const paymentIntentId = newId('pi_');
  const charge: Charge = {
    id: newId('ch_'),
    object: 'charge',
    amount: session.amount_total,
    amount_captured: session.amount_total,
    amount_refunded: 0,
    refunded: false,
    captured: true,
    paid: true,
    status: 'succeeded',
    currency: session.currency,
    payment_intent: paymentIntentId,
    // [mem] Stripe copies the PaymentIntent's metadata onto the charge it creates.
    metadata: { ...metadata },
    billing_details: { email, name },
    created,
    livemode: false,
  };
  const paymentIntent: PaymentIntent = {
    id: paymentIntentId,
    object: 'payment_intent',
    amount: session.amount_total,
    amount_received: session.amount_total,
    currency: session.currency,
    status: 'succeeded',
    latest_charge: charge.id,
    metadata: { ...metadata },
    created,
    livemode: false,
    payment_method_types: ['card'],
  };
  state.charges.set(charge.id, charge);
  state.paymentIntents.set(paymentIntent.id, paymentIntent);
  Object.assign(session, {
    status: 'complete',
    payment_status: 'paid',
    payment_intent: paymentIntent.id,
    customer_details: { email, name },
    url: null,
  } satisfies Partial<CheckoutSession>);
  const request: RequestRef = { id: null, idempotency_key: null };
  state.emit('checkout.session.completed', session, request, session.id);
  return session;
}
