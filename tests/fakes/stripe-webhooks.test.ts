// Webhook delivery from the fake (fakes/stripe/webhooks.ts): signatures the SDK accepts, retries, duplicates, order.
import { afterEach, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import type { StripeFake } from '@/fakes/stripe/server';
import { hook, sdk, sessionParams, startFake, startReceiver, WEBHOOK_SECRET, type Receiver } from './support';

const verifier = new Stripe('sk_test_x');
let receiver: Receiver | undefined;
let fake: StripeFake | undefined;

afterEach(async () => {
  await fake?.close();
  await receiver?.close();
});

async function setUp(status?: (n: number) => number, extra?: { retryBaseMs?: number; reverseHoldMs?: number }) {
  receiver = await startReceiver(status);
  fake = await startFake(receiver, extra);
  return { receiver, fake, stripe: sdk(fake.port) };
}

async function paidSession(f: StripeFake, stripe: Stripe) {
  const session = await stripe.checkout.sessions.create(sessionParams());
  const paid = await hook(f, `/_fake/sessions/${session.id}/pay`, { card: '4242 4242 4242 4242' });
  expect(paid.status).toBe(200);
  return session;
}

describe('webhooks', () => {
  it('sends checkout.session.completed with a signature constructEvent accepts', async () => {
    const { receiver: r, fake: f, stripe } = await setUp();
    const session = await paidSession(f, stripe);
    const [delivery] = await r.waitFor(1);
    const event = verifier.webhooks.constructEvent(delivery.body, delivery.signature, WEBHOOK_SECRET);
    expect(event.type).toBe('checkout.session.completed');
    const object = event.data.object as Stripe.Checkout.Session;
    expect(object).toMatchObject({
      id: session.id,
      status: 'complete',
      payment_status: 'paid',
      metadata: { orderId: '42' },
    });
    expect(object.payment_intent).toMatch(/^pi_/);
    expect(() => verifier.webhooks.constructEvent(delivery.body, delivery.signature, 'whsec_other')).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
  });

  it('retries after a 500 and records each attempt', async () => {
    const { receiver: r, fake: f, stripe } = await setUp((n) => (n === 1 ? 500 : 200));
    await paidSession(f, stripe);
    const [first, second] = await r.waitFor(2);
    expect(second.eventId).toBe(first.eventId);
    const events = (await (await fetch(`${f.url}/_fake/events`)).json()) as {
      data: { state: string; attempts: { attempt: number; status: number }[] }[];
    };
    expect(events.data[0].state).toBe('delivered');
    expect(events.data[0].attempts.map((a) => [a.attempt, a.status])).toEqual([
      [1, 500],
      [2, 200],
    ]);
  });

  it('retries when the endpoint is unreachable, then gives up after five retries', async () => {
    const { receiver: r, fake: f, stripe } = await setUp(undefined, { retryBaseMs: 5 });
    await r.close();
    await paidSession(f, stripe);
    const until = Date.now() + 5000;
    let state = '';
    let attempts = 0;
    while (state !== 'failed' && Date.now() < until) {
      await new Promise((res) => setTimeout(res, 50));
      const body = (await (await fetch(`${f.url}/_fake/events`)).json()) as {
        data: { state: string; attempts: unknown[] }[];
      };
      state = body.data[0].state;
      attempts = body.data[0].attempts.length;
    }
    expect(state).toBe('failed');
    expect(attempts).toBe(6);
  });

  it('delivers every event twice when deliverTwice is on', async () => {
    const { receiver: r, fake: f, stripe } = await setUp();
    await hook(f, '/_fake/config', { deliverTwice: true });
    await paidSession(f, stripe);
    const [a, b] = await r.waitFor(2);
    expect(b.eventId).toBe(a.eventId);
    expect(b.type).toBe('checkout.session.completed');
  });

  it('delivers one session’s events newest first when reverseOrder is on', async () => {
    const { receiver: r, fake: f, stripe } = await setUp(undefined, { reverseHoldMs: 300 });
    await hook(f, '/_fake/config', { reverseOrder: true });
    const session = await paidSession(f, stripe);
    const paid = await stripe.checkout.sessions.retrieve(session.id);
    await stripe.refunds.create({ payment_intent: String(paid.payment_intent), amount: 500 });
    const deliveries = await r.waitFor(3);
    expect(deliveries.map((d) => d.type)).toEqual(['refund.created', 'charge.refunded', 'checkout.session.completed']);
  });
});
