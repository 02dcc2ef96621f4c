import { createHash } from 'node:crypto';

/**
 * The client's address, for throttles and logs (ASVS 6.3.1 needs an address the client cannot
 * choose). How it reaches a route handler under `next start`:
 *
 * - Next fills `x-forwarded-for` from the socket only when the request has none, and keeps a
 *   client's own value as it is, so on its own that header is whatever the client typed.
 * - proxy.ts runs first for every page, server action and /api/auth request. It moves the header as
 *   received to `x-combtrace-forwarded-for`, deletes `x-forwarded-for` (so Next fills it again from
 *   the socket for the handler) and adds `x-combtrace-proxy`, a value derived from NEXTAUTH_SECRET
 *   that a client cannot make, so a handler can tell the proxy really ran.
 * - Here: the hops are what the client sent, then the socket address. With TRUSTED_PROXY_HOPS = 0
 *   (default: the app faces the internet) the socket address is the client. Behind N proxies of our
 *   own that each append the address they saw, the client is the Nth entry from the right; anything
 *   further left was written by the client and is never read.
 * - A request the proxy did not see gets "unverified" (one shared bucket, which fails closed).
 */
export const FORWARDED_CHAIN_HEADER = 'x-combtrace-forwarded-for';
export const PROXY_PROOF_HEADER = 'x-combtrace-proxy';
export const UNVERIFIED = 'unverified';

/** How many reverse proxies of ours stand in front of the app (TRUSTED_PROXY_HOPS, 0 to 5; default 0). */
export function trustedProxyHops(env: Record<string, string | undefined> = process.env): number {
  const n = Number(env.TRUSTED_PROXY_HOPS ?? 0);
  return Number.isInteger(n) && n >= 0 && n <= 5 ? n : 0;
}

/** The value only proxy.ts puts on a request; empty when there is no secret to derive it from. */
export function proxyProof(secret = process.env.NEXTAUTH_SECRET ?? ''): string {
  return secret ? createHash('sha256').update(`combtrace client address\n${secret}`).digest('base64url') : '';
}

/** In proxy.ts: rewrite the request headers as described above (changes `headers` in place). */
export function markForwardedHeaders(headers: Headers): void {
  headers.set(FORWARDED_CHAIN_HEADER, headers.get('x-forwarded-for') ?? '');
  headers.delete('x-forwarded-for');
  headers.set(PROXY_PROOF_HEADER, proxyProof());
}

function split(value: string | null | undefined): string[] {
  return (value ?? '')
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
}

/** Pure: the client among `sent` (what came in x-forwarded-for) and the socket address, trusting `hops` proxies. */
export function clientAddressFrom(sent: string | null | undefined, socket: string | null | undefined, hops: number) {
  const socketAddress = split(socket).at(-1);
  if (!socketAddress) return UNVERIFIED;
  const chain = [...split(sent), socketAddress];
  const client = chain[Math.max(0, chain.length - 1 - hops)];
  return client.slice(0, 64);
}

function read(headers: Headers | Record<string, unknown> | undefined, name: string): string | null {
  if (!headers) return null;
  if (headers instanceof Headers) return headers.get(name);
  const v = headers[name];
  return typeof v === 'string' ? v : Array.isArray(v) ? v.join(', ') : null;
}

/** The client's address from a request's headers, or "unverified" when proxy.ts did not see the request. */
export function clientIp(headers: Headers | Record<string, unknown> | undefined): string {
  const proof = proxyProof();
  if (!proof || read(headers, PROXY_PROOF_HEADER) !== proof) return UNVERIFIED;
  return clientAddressFrom(read(headers, FORWARDED_CHAIN_HEADER), read(headers, 'x-forwarded-for'), trustedProxyHops());
}
