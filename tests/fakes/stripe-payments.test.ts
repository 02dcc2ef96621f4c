// Paying (hosted page and hook), declines and refunds against the fake (fakes/stripe/payments.ts, refunds.ts).
import { describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import type { StripeFake } from '@/fakes/stripe/server';
import { hook, sessionParams, setUpStripeFake } from './support';

let fake: StripeFake;
let stripe: Stripe;
setUpStripeFake((started) => ({ fake, stripe } = started));

function payForm(card: string): string {
  return new URLSearchParams({ card, expiry: '12 / 34', cvc: '123', name: 'Test Buyer' }).toString();
}

async function postPayPage(id: string, card: string) {
  return fetch(`${fake.url}/pay/${id}`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: payForm(card),
    redirect: 'manual',
  });
}

describe('paying', () => {
  it('serves an accessible card form with a cancel link', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const html = await (await fetch(String(session.url))).text();
    for (const label of ['Card number', 'Expiry (MM / YY)', 'Security code (CVC)', 'Name on card'])
      expect(html).toContain(`>${label}</label>`);
    expect(html).toContain('autocomplete="cc-number"');
    expect(html).toContain('href="http://127.0.0.1:3100/cart"');
  });

  it('pays with 4242… on the hosted page and redirects 303 with the session id filled in', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const res = await postPayPage(session.id, '4242 4242 4242 4242');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`http://127.0.0.1:3100/orders/42?session_id=${session.id}`);
    const paid = await stripe.checkout.sessions.retrieve(session.id, { expand: ['payment_intent'] });
    expect(paid).toMatchObject({ status: 'complete', payment_status: 'paid', url: null });
    const pi = paid.payment_intent as Stripe.PaymentIntent;
    expect(pi).toMatchObject({ status: 'succeeded', amount: 2400, amount_received: 2400 });
    expect(pi.latest_charge).toMatch(/^ch_/);
  });

  it('declines 4000 0000 0000 0002 and leaves the session open and unpaid', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const res = await postPayPage(session.id, '4000 0000 0000 0002');
    expect(res.status).toBe(402);
    expect(await res.text()).toContain('Your card was declined.');
    const viaHook = await hook(fake, `/_fake/sessions/${session.id}/pay`, { card: '4000000000000002' });
    expect(viaHook.status).toBe(402);
    const after = await stripe.checkout.sessions.retrieve(session.id);
    expect(after).toMatchObject({ status: 'open', payment_status: 'unpaid', payment_intent: null });
  });

  it('asks for a test card when the number is not one', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const res = await postPayPage(session.id, '5555 5555 5555 4444');
    expect(res.status).toBe(400);
    expect(await res.text()).toContain('Use a test card');
  });
});

describe('refunds', () => {
  async function paid(): Promise<string> {
    const session = await stripe.checkout.sessions.create(sessionParams());
    await hook(fake, `/_fake/sessions/${session.id}/pay`);
    return String((await stripe.checkout.sessions.retrieve(session.id)).payment_intent);
  }

  async function chargeEvents(): Promise<Stripe.Charge[]> {
    const body = (await (await fetch(`${fake.url}/_fake/events?type=charge.refunded`)).json()) as {
      data: { event: { data: { object: Stripe.Charge } } }[];
    };
    return body.data.map((r) => r.event.data.object);
  }

  it('refunds partly, then fully, with charge.refunded after each', async () => {
    const paymentIntent = await paid();
    const partial = await stripe.refunds.create(
      { payment_intent: paymentIntent, amount: 1000 },
      { idempotencyKey: 'refund-42-1' },
    );
    expect(partial).toMatchObject({ amount: 1000, status: 'succeeded', payment_intent: paymentIntent });
    const rest = await stripe.refunds.create({ payment_intent: paymentIntent });
    expect(rest.amount).toBe(1400);
    const charges = await chargeEvents();
    expect(charges.map((c) => [c.amount_refunded, c.refunded])).toEqual([
      [1000, false],
      [2400, true],
    ]);
    const refundCreated = (await (await fetch(`${fake.url}/_fake/events?type=refund.created`)).json()) as {
      data: unknown[];
    };
    expect(refundCreated.data).toHaveLength(2);
  });

  it('rejects a refund larger than what is left with a 400', async () => {
    const paymentIntent = await paid();
    await stripe.refunds.create({ payment_intent: paymentIntent, amount: 2000 });
    const err = await stripe.refunds.create({ payment_intent: paymentIntent, amount: 500 }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(err).toMatchObject({ statusCode: 400, param: 'amount' });
    expect(await chargeEvents()).toHaveLength(1);
  });
});
