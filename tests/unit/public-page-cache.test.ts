import { describe, expect, it } from 'vitest';
import { contentSecurityPolicy, nonceOf } from '@/lib/http/csp';
import {
  PublicPageCache,
  RENDER_HEADER,
  isPublicPageView,
  respondWithNonce,
  storablePage,
  type StoredPage,
} from '@/lib/http/public-page-cache';

const page = (nonce = 'cmVuZGVyZWQ='): StoredPage => ({
  body: `<script nonce="${nonce}">self.__next_f.push([0])</script><p>Our honey</p><script nonce="${nonce}" src="/a.js"></script>`,
  nonce,
  status: 200,
  headers: [
    ['content-type', 'text/html; charset=utf-8'],
    ['x-frame-options', 'DENY'],
    ['link', `</a.css>; rel=preload; as="style"; nonce="${nonce}"`],
  ],
});

describe('which requests the public page cache may answer', () => {
  const h = (init: Record<string, string> = {}) => new Headers(init);
  it('signed-out page views of the shop and lot pages', () => {
    for (const path of ['/', '/products', '/products/wildflower-340', '/lot/HH26-001']) {
      expect(isPublicPageView('GET', path, '', h()), path).toBe(true);
    }
    // Cookies other than the session (e.g. next-auth's CSRF cookie) do not change the page.
    expect(isPublicPageView('GET', '/products', '', h({ cookie: 'next-auth.csrf-token=abc' }))).toBe(true);
  });
  it('never a signed-in visitor, another method, a query, a client navigation or a private page', () => {
    expect(isPublicPageView('GET', '/products', '', h({ cookie: 'a=1; next-auth.session-token=x' }))).toBe(false);
    expect(isPublicPageView('GET', '/products', '', h({ cookie: '__Secure-next-auth.session-token.0=x' }))).toBe(false);
    expect(isPublicPageView('POST', '/products', '', h())).toBe(false);
    expect(isPublicPageView('GET', '/products', '?sort=price', h())).toBe(false);
    expect(isPublicPageView('GET', '/products', '', h({ rsc: '1' }))).toBe(false);
    expect(isPublicPageView('GET', '/products', '', h({ 'next-action': 'abc' }))).toBe(false);
    expect(isPublicPageView('GET', '/products', '', h({ [RENDER_HEADER]: '1' }))).toBe(false);
    for (const path of ['/cart', '/account', '/orders/CT-1', '/admin', '/sign-in', '/products/a/b', '/lot/../admin']) {
      expect(isPublicPageView('GET', path, '', h()), path).toBe(false);
    }
  });
});

describe('answering from a stored page', () => {
  it('swaps every copy of the rendered nonce for the fresh one, in the scripts and the policy', async () => {
    const res = respondWithNonce(page(), 'ZnJlc2g=');
    const body = await res.text();
    expect(body).not.toContain('cmVuZGVyZWQ=');
    expect(body.match(/nonce="ZnJlc2g="/g)).toHaveLength(2);
    expect(nonceOf(res.headers.get('content-security-policy'))).toBe('ZnJlc2g=');
    expect(res.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
    expect(res.headers.get('x-frame-options')).toBe('DENY');
    expect(res.headers.get('link')).toBe('</a.css>; rel=preload; as="style"; nonce="ZnJlc2g="');
  });

  it('stores only a plain 200 HTML page that sets no cookie and whose nonce is known', async () => {
    const csp = {
      'content-security-policy': contentSecurityPolicy('cmVuZGVyZWQ='),
      'content-type': 'text/html; charset=utf-8',
    };
    const ok = await storablePage(
      new Response(page().body, { headers: { ...csp, 'content-length': '10', 'set-cookie2': 'x' } }),
    );
    expect(ok?.nonce).toBe('cmVuZGVyZWQ=');
    expect(ok?.headers.map(([k]) => k)).not.toContain('content-length');
    expect(ok?.headers.map(([k]) => k)).not.toContain('content-security-policy');
    expect(await storablePage(new Response('gone', { status: 404, headers: csp }))).toBeNull();
    expect(await storablePage(new Response('x', { headers: { ...csp, 'set-cookie': 'a=b' } }))).toBeNull();
    expect(await storablePage(new Response('x', { headers: { 'content-type': 'text/html' } }))).toBeNull();
    expect(
      await storablePage(new Response('{}', { headers: { ...csp, 'content-type': 'application/json' } })),
    ).toBeNull();
  });
});

describe('PublicPageCache', () => {
  it('renders once for simultaneous misses, then answers from memory until the time is up', async () => {
    let clock = 0;
    let renders = 0;
    const cache = new PublicPageCache(5000, 10, () => clock);
    const render = async () => {
      renders++;
      await new Promise((r) => setTimeout(r, 5));
      return page();
    };
    const first = await Promise.all(Array.from({ length: 10 }, () => cache.get('/products', render)));
    expect(renders).toBe(1);
    expect(first.every((p) => p?.body === page().body)).toBe(true);
    clock = 4999;
    await cache.get('/products', render);
    expect(renders).toBe(1);
    clock = 5000;
    await cache.get('/products', render);
    expect(renders).toBe(2);
  });

  it('does not keep what cannot be stored, survives a failed render, and drops the least recently used', async () => {
    const cache = new PublicPageCache(5000, 2, () => 0);
    let renders = 0;
    expect(
      await cache.get('/lot/NOPE', async () => {
        renders++;
        return null;
      }),
    ).toBeNull();
    expect(
      await cache.get('/lot/NOPE', async () => {
        renders++;
        return null;
      }),
    ).toBeNull();
    expect(renders).toBe(2);
    expect(
      await cache.get('/', async () => {
        throw new Error('connection refused');
      }),
    ).toBeNull();

    const counted = (name: string) => async () => {
      renders++;
      return { ...page(), body: name };
    };
    renders = 0;
    await cache.get('/a', counted('a'));
    await cache.get('/b', counted('b'));
    await cache.get('/a', counted('a')); // /a used again, so /b is the oldest
    await cache.get('/c', counted('c'));
    expect(renders).toBe(3);
    await cache.get('/a', counted('a'));
    expect(renders).toBe(3);
    await cache.get('/b', counted('b'));
    expect(renders).toBe(4);
  });

  it('is off at zero seconds', () => {
    expect(new PublicPageCache(0).enabled).toBe(false);
    expect(new PublicPageCache(5000).enabled).toBe(true);
  });
});
