// Shared set-up for the fake tests: a real SDK client, and a local endpoint that records webhooks.
import { createServer, type IncomingMessage } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterAll, beforeAll, beforeEach } from 'vitest';
import { startStripeFake, type StripeFake } from '@/fakes/stripe/server';

export const WEBHOOK_SECRET = 'whsec_fake_tests';

export type Delivery = { body: string; signature: string; type: string; eventId: string };

export type Receiver = {
  url: string;
  deliveries: Delivery[];
  /** Resolves once `count` deliveries arrived; rejects after `timeoutMs`. */
  waitFor(count: number, timeoutMs?: number): Promise<Delivery[]>;
  /** Forget what arrived so far (call after `/_fake/reset`). */
  clear(): void;
  close(): Promise<void>;
};

async function text(req: IncomingMessage): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of req) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

/** `status(n)` answers the n-th delivery (1-based); 200 unless told otherwise. */
export async function startReceiver(status: (n: number) => number = () => 200): Promise<Receiver> {
  const deliveries: Delivery[] = [];
  const server = createServer(async (req, res) => {
    const body = await text(req);
    const parsed = JSON.parse(body) as { id: string; type: string };
    deliveries.push({
      body,
      signature: String(req.headers['stripe-signature']),
      type: parsed.type,
      eventId: parsed.id,
    });
    res.writeHead(status(deliveries.length)).end();
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}/api/stripe/webhook`,
    deliveries,
    async waitFor(count, timeoutMs = 5000) {
      const until = Date.now() + timeoutMs;
      while (deliveries.length < count) {
        if (Date.now() > until) throw new Error(`expected ${count} webhook deliveries, got ${deliveries.length}`);
        await new Promise((r) => setTimeout(r, 10));
      }
      return deliveries;
    },
    clear() {
      deliveries.length = 0;
    },
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}

export function sdk(port: number): Stripe {
  return new Stripe('sk_test_x', { host: '127.0.0.1', port, protocol: 'http', telemetry: false, maxNetworkRetries: 0 });
}

export async function startFake(
  receiver: Receiver,
  extra: { retryBaseMs?: number; reverseHoldMs?: number } = {},
): Promise<StripeFake> {
  return startStripeFake({
    port: 0,
    webhookUrl: receiver.url,
    webhookSecret: WEBHOOK_SECRET,
    retryBaseMs: 20,
    ...extra,
  });
}

export const sessionParams = (quantity = 2): Stripe.Checkout.SessionCreateParams => ({
  mode: 'payment',
  success_url: 'http://127.0.0.1:3100/orders/42?session_id={CHECKOUT_SESSION_ID}',
  cancel_url: 'http://127.0.0.1:3100/cart',
  customer_email: 'buyer@example.test',
  metadata: { orderId: '42' },
  line_items: [
    { quantity, price_data: { currency: 'usd', unit_amount: 1200, product_data: { name: 'Wildflower 340 g' } } },
  ],
});

/** POST JSON to a `/_fake` hook. */
export async function hook(
  fake: StripeFake,
  path: string,
  body: unknown = {},
): Promise<{ status: number; json: Record<string, unknown> }> {
  const res = await fetch(`${fake.url}${path}`, { method: 'POST', body: JSON.stringify(body) });
  return { status: res.status, json: (await res.json()) as Record<string, unknown> };
}

export type StartedFake = { receiver: Receiver; fake: StripeFake; stripe: Stripe };

/**
 * For a test file: starts a webhook receiver, a fake that delivers to it and an SDK client once,
 * hands them to `use`, resets the fake and forgets the deliveries before each test, stops both at the end.
 */
export function setUpStripeFake(use: (started: StartedFake) => void): void {
  let started: StartedFake | undefined;
  beforeAll(async () => {
    const receiver = await startReceiver();
    const fake = await startFake(receiver);
    started = { receiver, fake, stripe: sdk(fake.port) };
    use(started);
  });
  afterAll(async () => {
    await started?.fake.close();
    await started?.receiver.close();
  });
  beforeEach(async () => {
    await hook(started!.fake, '/_fake/reset');
    started!.receiver.clear();
  });
}
