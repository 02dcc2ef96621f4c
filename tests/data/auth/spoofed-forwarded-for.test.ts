import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { authenticate, SIGN_IN_LIMITS } from '@/lib/data/auth/sign-in';
import {
  clientAddressFrom,
  clientIp,
  FORWARDED_CHAIN_HEADER,
  markForwardedHeaders,
  PROXY_PROOF_HEADER,
  trustedProxyHops,
} from '@/lib/http/client-ip';
import { POST } from '@/app/api/auth/[...nextauth]/route';
import { headersFromClient } from '@/tests/support/session';
import { hashPassword } from '@/lib/auth/password';

process.env.NEXTAUTH_SECRET ??= 'db-test-secret-not-for-production-0000000';
afterAll(closeDb);

async function makeUser(email: string, password: string) {
  await getDb().models.User.create({
    email,
    name: 'Throttle Test',
    role: 'customer',
    passwordHash: await hashPassword(password),
  });
}

describe('the sign-in throttle does not trust a client-set X-Forwarded-For', () => {
  it('takes the socket address, not the first X-Forwarded-For value the client typed', async () => {
    // What the handler sees after proxy.ts: the socket in x-forwarded-for, the client's header aside.
    const h = new Headers(await headersFromClient('198.51.100.20', '203.0.113.8'));
    expect(clientIp(h)).toBe('198.51.100.20');
    const list = new Headers(await headersFromClient('198.51.100.20', '198.51.100.1, 203.0.113.7'));
    expect(clientIp(list)).toBe('198.51.100.20');
  });

  it('the proxy moves a client X-Forwarded-For aside and marks the request', () => {
    const h = new Headers({ 'x-forwarded-for': '203.0.113.8', [PROXY_PROOF_HEADER]: 'forged' });
    markForwardedHeaders(h);
    expect(h.get('x-forwarded-for')).toBeNull(); // Next fills it again from the socket
    expect(h.get(FORWARDED_CHAIN_HEADER)).toBe('203.0.113.8');
    expect(h.get(PROXY_PROOF_HEADER)).not.toBe('forged');
  });

  it('a request the proxy did not see, or with a forged mark, shares one "unverified" address', () => {
    expect(clientIp(new Headers({ 'x-forwarded-for': '203.0.113.8' }))).toBe('unverified');
    expect(clientIp({ 'x-forwarded-for': '203.0.113.8', [PROXY_PROOF_HEADER]: 'guess' })).toBe('unverified');
  });

  it('behind N trusted proxies, reads the Nth address from the right and never further left', () => {
    expect(clientAddressFrom('198.51.100.1, 203.0.113.7', '10.0.0.2', 0)).toBe('10.0.0.2');
    expect(clientAddressFrom('198.51.100.1, 203.0.113.7', '10.0.0.2', 1)).toBe('203.0.113.7');
    expect(clientAddressFrom('198.51.100.1, 203.0.113.7', '10.0.0.2', 2)).toBe('198.51.100.1');
    expect(clientAddressFrom('', '10.0.0.2', 1)).toBe('10.0.0.2');
    expect(trustedProxyHops({})).toBe(0);
    expect(trustedProxyHops({ TRUSTED_PROXY_HOPS: '1' })).toBe(1);
    expect(trustedProxyHops({ TRUSTED_PROXY_HOPS: 'lots' })).toBe(0);
  });

  it('six wrong passwords, then the right one with X-Forwarded-For: 203.0.113.8, still gets 429', async () => {
    await makeUser('spoof-one@example.test', 'the right phrase');
    const call = async (password: string, sent: string) => {
      const body = new URLSearchParams({ email: 'spoof-one@example.test', password, csrfToken: 'x', json: 'true' });
      const req = new Request('http://127.0.0.1:3100/api/auth/callback/credentials', {
        method: 'POST',
        body,
        headers: {
          'content-type': 'application/x-www-form-urlencoded',
          ...(await headersFromClient('198.51.100.30', sent)),
        },
      });
      return POST(req, { params: Promise.resolve({ nextauth: ['callback', 'credentials'] }) });
    };
    for (let i = 0; i < 6; i++)
      await authenticate(
        'spoof-one@example.test',
        `wrong ${i}`,
        clientIp(new Headers(await headersFromClient('198.51.100.30'))),
      );
    expect((await call('the right phrase', '203.0.113.8')).status).toBe(429);
    expect((await call('the right phrase', '198.51.100.1, 203.0.113.7')).status).toBe(429);
  });
});

describe('the per-account limit counts failures from every address', () => {
  it(`throttles an account after ${SIGN_IN_LIMITS.perAccount} failures spread over many addresses`, async () => {
    await makeUser('spread@example.test', 'spread phrase ok');
    // The owner signed in from home before the attack.
    expect((await authenticate('spread@example.test', 'spread phrase ok', '192.0.2.50')).status).toBe('ok');
    for (let i = 0; i < SIGN_IN_LIMITS.perAccount; i++) {
      expect((await authenticate('spread@example.test', `guess ${i}`, `203.0.113.${100 + i}`)).status).toBe('invalid');
    }
    // A fresh address, even with the right password, must wait…
    expect((await authenticate('spread@example.test', 'spread phrase ok', '203.0.113.250')).status).toBe('throttled');
    // …but the address the owner already signed in from still works (no lock-out by strangers).
    expect((await authenticate('spread@example.test', 'spread phrase ok', '192.0.2.50')).status).toBe('ok');
  });
});
