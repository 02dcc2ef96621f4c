import 'server-only';
import { createHmac, timingSafeEqual } from 'node:crypto';

/**
 * A guest sees their order through a link carrying an HMAC of the order number, keyed with the
 * app's secret: unguessable, and nothing to store. 128 bits, base64url.
 */
function secret(): string {
  const s = process.env.ORDER_LINK_SECRET || process.env.NEXTAUTH_SECRET;
  if (!s) throw new Error('NEXTAUTH_SECRET is not set.');
  return s;
}

export function orderToken(orderNumber: string): string {
  return createHmac('sha256', secret()).update(`order-link:${orderNumber}`).digest('base64url').slice(0, 22);
}

export function checkOrderToken(orderNumber: string, token: string | null | undefined): boolean {
  if (!token) return false;
  const want = Buffer.from(orderToken(orderNumber));
  const got = Buffer.from(token);
  return want.length === got.length && timingSafeEqual(want, got);
}
