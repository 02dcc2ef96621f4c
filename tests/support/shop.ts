import { PROXY_PROOF_HEADER, proxyProof } from '@/lib/http/client-ip';
// Shop integration fixtures: the Stripe fake in-process (real SDK, real HTTP), delivering its
// webhooks straight into our route handler, and products with released lots and stock.
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { startStripeFake, type StripeFake } from '@/fakes/stripe/server';
import { getDb } from '@/lib/db';
import { POST as webhookPOST } from '@/app/api/stripe/webhook/route';
import { POST as checkoutPOST } from '@/app/api/checkout/route';

export const SHOP_WEBHOOK_SECRET = 'whsec_shop_tests';

export type ShopFake = { fake: StripeFake; close(): Promise<void>; webhookStatuses: number[] };

/** `retryBaseMs` spaces the fake's webhook retries (default 50 ms); a large value lets a test look between a failed delivery and the redelivery. */
export async function startShopFake(options: { retryBaseMs?: number } = {}): Promise<ShopFake> {
  const webhookStatuses: number[] = [];
  const receiver = createServer(async (req, res) => {
    const chunks: Buffer[] = [];
    for await (const c of req) chunks.push(c as Buffer);
    const request = new Request('http://127.0.0.1/api/stripe/webhook', {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        'stripe-signature': String(req.headers['stripe-signature'] ?? ''),
      },
      body: Buffer.concat(chunks).toString('utf8'),
    });
    const answer = await webhookPOST(request);
    webhookStatuses.push(answer.status);
    res.writeHead(answer.status, { 'content-type': 'application/json' }).end(await answer.text());
  });
  await new Promise<void>((r) => receiver.listen(0, '127.0.0.1', r));
  const { port } = receiver.address() as AddressInfo;
  const fake = await startStripeFake({
    port: 0,
    webhookUrl: `http://127.0.0.1:${port}/api/stripe/webhook`,
    webhookSecret: SHOP_WEBHOOK_SECRET,
    retryBaseMs: options.retryBaseMs ?? 50,
  });
  Object.assign(process.env, {
    STRIPE_SECRET_KEY: 'sk_test_shop',
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(fake.port),
    STRIPE_API_PROTOCOL: 'http',
    STRIPE_WEBHOOK_SECRET: SHOP_WEBHOOK_SECRET,
    APP_URL: 'http://127.0.0.1:3999',
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? 'shop-test-secret-000000000000000000',
  });
  return {
    fake,
    webhookStatuses,
    async close() {
      await fake.close();
      await new Promise<void>((r) => {
        receiver.close(() => r());
        receiver.closeAllConnections();
      });
    },
  };
}

let seq = 0;
/** Tells this file's guests and addresses apart from another test file's (each file starts its counters at 0). */
const RUN = Math.floor(Math.random() * 0xffff).toString(16);
/** A product with `lots` released lots holding the given jar counts (oldest best-before first). */
export async function makeProduct(
  tag: string,
  jarsPerLot: number[],
  priceCents = 1200,
): Promise<{ productId: number; lotIds: number[]; name: string }> {
  const { Product, Lot, StockLevel } = getDb().models;
  const u = `${tag}-${process.pid}-${++seq}`.toLowerCase();
  const name = `Test honey ${u}`;
  const p = await Product.create({
    slug: `t-${u}`,
    name,
    netGrams: 340,
    declaredAmount: 340,
    containerKind: 'glass jar',
    containerGrams: 180,
    priceCents,
  });
  const lotIds: number[] = [];
  for (let i = 0; i < jarsPerLot.length; i++) {
    const lot = await Lot.create({
      code: `T${seq}-${process.pid % 10000}-${i}`.slice(0, 20),
      floralSource: i === 0 ? 'Clover' : 'Linden',
      stage: 'released',
      bestBeforeOn: `202${8 + i}-06-30`,
      createdBy: null,
    });
    await StockLevel.create({
      productId: p.id,
      lotId: lot.id,
      onHand: jarsPerLot[i],
      reserved: 0,
      bestBeforeOn: `202${8 + i}-06-30`,
    });
    lotIds.push(lot.id);
  }
  return { productId: p.id, lotIds, name };
}

export async function stockOf(productId: number): Promise<{ lotId: number; onHand: number; reserved: number }[]> {
  const rows = await getDb().models.StockLevel.findAll({ where: { productId }, order: [['bestBeforeOn', 'ASC']] });
  return rows.map((r) => ({ lotId: r.lotId, onHand: r.onHand, reserved: r.reserved }));
}

export async function waitUntil<T>(read: () => Promise<T>, ok: (v: T) => boolean, timeoutMs = 8000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await read();
    if (ok(v) || Date.now() > until) return v;
    await new Promise((r) => setTimeout(r, 50));
  }
}

export function hook(fake: StripeFake, path: string, body: unknown = {}) {
  return fetch(`${fake.url}${path}`, { method: 'POST', body: JSON.stringify(body) }).then(async (r) => ({
    status: r.status,
    json: (await r.json()) as Record<string, unknown>,
  }));
}

export const guest = (
  items: { productId: number; quantity: number }[],
  email = `guest-${RUN}-${++seq}@example.test`,
) => ({
  items,
  email,
  name: 'Ada Fenwick',
  phone: '',
  fulfilment: 'pickup' as const,
});

export const orderOf = (number: string) => getDb().models.Order.findOne({ where: { number } });

let ipSeq = 0;
/** A fresh client address per test checkout (2001:db8::/32, the documentation range), so per-address checkout limits do not pile up across tests and files. */
export const nextIp = () => `2001:db8:${RUN}::${(++ipSeq).toString(16)}`;

/** A POST /api/checkout request from `ip` (a fresh address unless given). */
export const checkoutRequest = (body: unknown, ip: string = nextIp()) =>
  new Request('http://127.0.0.1/api/checkout', {
    method: 'POST',
    // As proxy.ts hands it on: the socket address in x-forwarded-for and its mark (lib/http/client-ip.ts).
    headers: { 'x-forwarded-for': ip, [PROXY_PROOF_HEADER]: proxyProof() },
    body: JSON.stringify(body),
  });

/** A guest checkout through the real route handler (it must succeed); the order it made. */
export async function startOrder(items: { productId: number; quantity: number }[]) {
  const res = await checkoutPOST(checkoutRequest(guest(items)));
  if (res.status !== 200) throw new Error(`checkout answered ${res.status}: ${await res.text()}`);
  return (await orderOf(((await res.json()) as { number: string }).number))!;
}
