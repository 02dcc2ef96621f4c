// Checkout Sessions through the real SDK against the fake (fakes/stripe/sessions.ts, idempotency.ts).
import { describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import type { StripeFake } from '@/fakes/stripe/server';
import { hook, sessionParams, setUpStripeFake, type Receiver } from './support';

let receiver: Receiver;
let fake: StripeFake;
let stripe: Stripe;
setUpStripeFake((started) => ({ receiver, fake, stripe } = started));

describe('checkout sessions', () => {
  it('creates, retrieves with line items, lists line items and expires', async () => {
    const created = await stripe.checkout.sessions.create(sessionParams());
    expect(created.id).toMatch(/^cs_test_/);
    expect(created).toMatchObject({
      status: 'open',
      payment_status: 'unpaid',
      amount_total: 2400,
      currency: 'usd',
      payment_intent: null,
    });
    expect(created.url).toBe(`${fake.url}/pay/${created.id}`);
    expect(created.expires_at - created.created).toBe(24 * 60 * 60);

    const read = await stripe.checkout.sessions.retrieve(created.id, { expand: ['line_items'] });
    expect(read.metadata).toEqual({ orderId: '42' });
    expect(read.line_items?.data[0]).toMatchObject({
      description: 'Wildflower 340 g',
      quantity: 2,
      amount_total: 2400,
    });
    const items = await stripe.checkout.sessions.listLineItems(created.id, { limit: 100 });
    expect(items.data).toHaveLength(1);
    expect(items.has_more).toBe(false);

    const expired = await stripe.checkout.sessions.expire(created.id);
    expect(expired).toMatchObject({ status: 'expired', url: null });
    await expect(stripe.checkout.sessions.expire(created.id)).rejects.toBeInstanceOf(
      Stripe.errors.StripeInvalidRequestError,
    );
  });

  it('answers 404 with an invalid_request_error for an unknown session', async () => {
    const err = await stripe.checkout.sessions.retrieve('cs_test_nope').catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(err).toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });

  it('accepts expires_at between 30 minutes and 24 hours only', async () => {
    const now = Math.floor(Date.now() / 1000);
    const ok = await stripe.checkout.sessions.create({ ...sessionParams(), expires_at: now + 3600 });
    expect(ok.expires_at).toBe(now + 3600);
    const tooSoon = stripe.checkout.sessions.create({ ...sessionParams(), expires_at: now + 60 });
    await expect(tooSoon).rejects.toMatchObject({ type: 'StripeInvalidRequestError', param: 'expires_at' });
  });

  it('replays the first response for the same idempotency key and parameters', async () => {
    const key = 'checkout-order-42-v1';
    const first = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: key });
    const again = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: key });
    expect(again.id).toBe(first.id);
    expect(again.lastResponse.headers['idempotent-replayed']).toBe('true');
    const list = await stripe.checkout.sessions.list();
    expect(list.data).toHaveLength(1);
  });

  it('rejects the same key with different parameters as an idempotency error', async () => {
    const key = 'checkout-order-43-v1';
    await stripe.checkout.sessions.create(sessionParams(2), { idempotencyKey: key });
    const err = await stripe.checkout.sessions
      .create(sessionParams(3), { idempotencyKey: key })
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect(err).toMatchObject({ statusCode: 400 });
  });

  it('answers 409 while a request with the same key is still running', async () => {
    await hook(fake, '/_fake/config', { latencyMs: 200 });
    const key = 'checkout-order-44-v1';
    const [a, b] = await Promise.allSettled([
      stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: key }),
      stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: key }),
    ]);
    const rejected = [a, b].filter((r): r is PromiseRejectedResult => r.status === 'rejected');
    expect(rejected).toHaveLength(1);
    expect(rejected[0].reason).toMatchObject({ statusCode: 409 });
  });

  it('fails the next N API requests with a 500 without saving the key', async () => {
    await hook(fake, '/_fake/config', { failNext: 1 });
    const key = 'checkout-order-45-v1';
    const err = await stripe.checkout.sessions
      .create(sessionParams(), { idempotencyKey: key })
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeAPIError);
    const retried = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: key });
    expect(retried.status).toBe('open');
  });

  it('expires a session through the test hook and sends checkout.session.expired', async () => {
    const created = await stripe.checkout.sessions.create(sessionParams());
    const res = await hook(fake, `/_fake/sessions/${created.id}/expire`);
    expect(res.status).toBe(200);
    expect((await stripe.checkout.sessions.retrieve(created.id)).status).toBe('expired');
    const [delivery] = await receiver.waitFor(1);
    expect(delivery.type).toBe('checkout.session.expired');
  });
});
