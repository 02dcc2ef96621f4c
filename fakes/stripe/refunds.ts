// Refunds (docs.stripe.com/api/refunds/create): partial or full, never more than
// what is left; each one sends `refund.created` and `charge.refunded` with the updated Charge.
import { ApiError, invalid, missingParam, newId, noSuch, nowSeconds } from './errors';
import { int, metadata, str, type Params } from './params';
import type { StripeState } from './state';
import type { Charge, Refund, RequestRef } from './types';

const REASONS = ['duplicate', 'fraudulent', 'requested_by_customer'] as const;
const isReason = (value: string): value is NonNullable<Refund['reason']> => REASONS.some((r) => r === value);

function findCharge(state: StripeState, params: Params): Charge {
  const chargeId = str(params.charge, 'charge');
  const paymentIntentId = str(params.payment_intent, 'payment_intent');
  if (chargeId) {
    const charge = state.charges.get(chargeId);
    if (!charge) throw noSuch('charge', chargeId, 'charge');
    return charge;
  }
  if (!paymentIntentId) throw missingParam('charge');
  const paymentIntent = state.paymentIntents.get(paymentIntentId);
  if (!paymentIntent) throw noSuch('payment_intent', paymentIntentId, 'payment_intent');
  const charge = state.charges.get(paymentIntent.latest_charge);
  if (!charge) throw invalid(`PaymentIntent ${paymentIntentId} has no charge to refund.`, 'payment_intent');
  return charge;
}

function reasonParam(params: Params): Refund['reason'] {
  const value = str(params.reason, 'reason');
  if (!value) return null;
  if (!isReason(value)) throw invalid(`Invalid reason: ${value}`, 'reason');
  return value;
}

export function createRefund(state: StripeState, params: Params, request: RequestRef): Refund {
  const charge = findCharge(state, params);
  const left = charge.amount - charge.amount_refunded;
  if (left === 0) {
    throw new ApiError(
      400,
      'invalid_request_error',
      `Charge ${charge.id} has already been refunded.`,
      'charge_already_refunded',
    );
  }
  const amount = int(params.amount, 'amount', 1) ?? left;
  if (amount > left) {
    throw invalid(
      `Refund amount (${amount}) is greater than unrefunded amount on charge (${left}).`,
      'amount',
      'amount_too_large',
    );
  }
  const reason = reasonParam(params);
  const refund: Refund = {
    id: newId('re_'),
    object: 'refund',
    amount,
    currency: charge.currency,
    charge: charge.id,
    payment_intent: charge.payment_intent,
    reason,
    status: 'succeeded',
    metadata: metadata(params.metadata, 'metadata'),
    created: nowSeconds(),
  };
  charge.amount_refunded += amount;
  // `refunded` is true only once the whole charge is refunded (Stripe's Charge object).
  charge.refunded = charge.amount_refunded === charge.amount;
  state.refunds.set(refund.id, refund);
  const sessionId = state.sessionIdForPaymentIntent(charge.payment_intent);
  state.emit('charge.refunded', charge, request, sessionId);
  state.emit('refund.created', refund, request, sessionId);
  return refund;
}
