import Stripe from 'stripe';
import { stripe, webhookSecret } from '@/lib/payments/stripe';
import { applyStripeEvent } from '@/lib/data/orders/payment';
import { kickMail } from '@/lib/mail/outbox';
import { readTextLimited } from '@/lib/http/body';
import { handleRouteError } from '@/lib/http/json';

export const dynamic = 'force-dynamic';

/** Stripe's events are a few kilobytes; anything far larger is not one of them (read while streaming). */
const MAX_EVENT_BYTES = 1_000_000;

/**
 * Stripe's webhook. Only a request signed with our endpoint secret is read (constructEvent checks
 * the HMAC and the 5-minute tolerance on the raw body); anything else is a 400 and changes nothing.
 * Each event id is applied once (lib/data/orders/payment.ts); a failure answers 500 so Stripe retries.
 */
export async function POST(req: Request): Promise<Response> {
  const signature = req.headers.get('stripe-signature');
  if (!signature) return Response.json({ error: 'Missing Stripe-Signature header.' }, { status: 400 });
  let body: string;
  try {
    body = await readTextLimited(req, MAX_EVENT_BYTES, 'The event is too large.');
  } catch (err) {
    return handleRouteError(err);
  }
  let event: Stripe.Event;
  try {
    event = stripe().webhooks.constructEvent(body, signature, webhookSecret());
  } catch (err) {
    const message =
      err instanceof Stripe.errors.StripeSignatureVerificationError
        ? 'The signature does not match.'
        : 'The event could not be read.';
    return Response.json({ error: message }, { status: 400 });
  }
  try {
    const { outcome, mail } = await applyStripeEvent(event);
    if (mail) kickMail();
    return Response.json({ received: true, outcome });
  } catch (err) {
    const ref = crypto.randomUUID().slice(0, 8);
    console.error(`[stripe webhook ${ref}] ${event.type} ${event.id}`, err);
    return Response.json({ error: `Could not apply the event. Reference ${ref}.` }, { status: 500 });
  }
}
