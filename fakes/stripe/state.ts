// Everything the Stripe fake remembers, in memory only; `POST /_fake/reset` empties it.
import Stripe from 'stripe';
import { newId, nowSeconds } from './errors';
import type {
  Charge,
  CheckoutSession,
  EventRecord,
  FakeConfig,
  LineItem,
  PaymentIntent,
  Refund,
  RequestRef,
  StripeObject,
} from './types';
import { defaultConfig } from './types';

export class StripeState {
  sessions = new Map<string, CheckoutSession>();
  lineItems = new Map<string, LineItem[]>();
  paymentIntents = new Map<string, PaymentIntent>();
  charges = new Map<string, Charge>();
  refunds = new Map<string, Refund>();
  /** `payment_intent_data[metadata]` per session: it goes on the PaymentIntent, not the session. */
  paymentIntentMetadata = new Map<string, Record<string, string>>();
  events: EventRecord[] = [];
  config: FakeConfig = defaultConfig();

  constructor(private readonly onEvent: (record: EventRecord) => void) {}

  /** Events carry a snapshot: later changes to the object must not rewrite what was sent. */
  emit(type: string, object: StripeObject, request: RequestRef, sessionId: string | null): EventRecord {
    const record: EventRecord = {
      event: {
        id: newId('evt_'),
        object: 'event',
        // The version the pinned SDK sends (its Stripe-Version header), so `constructEvent` users see matching shapes.
        api_version: Stripe.API_VERSION,
        created: nowSeconds(),
        livemode: false,
        pending_webhooks: 1,
        request,
        type,
        data: { object: structuredClone(object) },
      },
      sessionId,
      state: 'pending',
      attempts: [],
    };
    this.events.push(record);
    this.onEvent(record);
    return record;
  }

  /** Finds the Checkout Session behind a PaymentIntent, to group refund events with it. */
  sessionIdForPaymentIntent(paymentIntentId: string): string | null {
    for (const s of this.sessions.values()) if (s.payment_intent === paymentIntentId) return s.id;
    return null;
  }

  /** Stripe expires open sessions at `expires_at` and sends `checkout.session.expired`. */
  sweepExpired(now = nowSeconds()): void {
    for (const s of this.sessions.values()) {
      if (s.status === 'open' && s.expires_at <= now) this.expire(s, { id: null, idempotency_key: null });
    }
  }

  expire(session: CheckoutSession, request: RequestRef): void {
    session.status = 'expired';
    session.url = null;
    this.emit('checkout.session.expired', session, request, session.id);
  }

  reset(): void {
    this.sessions.clear();
    this.lineItems.clear();
    this.paymentIntents.clear();
    this.charges.clear();
    this.refunds.clear();
    this.paymentIntentMetadata.clear();
    this.events = [];
    this.config = defaultConfig();
  }
}
