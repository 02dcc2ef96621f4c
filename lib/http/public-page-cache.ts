import { contentSecurityPolicy, nonceOf } from './csp';

/**
 * A few seconds of memory for the public pages that signed-out visitors see (docs/architecture.md, "The public page cache").
 *
 * Every page carries its own CSP nonce, so Next renders every page per request — about five times the
 * cost of a JSON route. The signed-out views of the shop home, the catalogue, a product page and a
 * public lot page are the same for every visitor (the cart lives in the browser), so proxy.ts keeps
 * each for PUBLIC_PAGE_CACHE_SECONDS (default 5; 0 turns this off) and answers from memory with a
 * fresh nonce swapped in: every response still has its own unpredictable nonce in its header and its
 * scripts, and the nonce the page was rendered with never leaves the server.
 *
 * What may be that old: stock shown as "In stock". Checkout re-checks every line under row locks and
 * answers 409 with what is left, so a stale page can never sell a jar that is not there. Signed-in
 * people (staff previewing the shop, customers) always get a fresh render.
 */

/** Set on the proxy's own render request, so it goes straight to Next instead of to this cache. */
export const RENDER_HEADER = 'x-combtrace-render';

const PUBLIC_PATHS = [/^\/$/, /^\/products$/, /^\/products\/[A-Za-z0-9-]{1,120}$/, /^\/lot\/[A-Za-z0-9-]{1,60}$/];
const SESSION_COOKIE = /(?:^|;\s*)(?:__Secure-)?next-auth\.session-token(?:\.\d+)?=/;
/** Client-side navigation, prefetches and server actions ask for other things than the HTML page. */
const NOT_A_PAGE_VIEW = ['rsc', 'next-router-prefetch', 'next-router-state-tree', 'next-action', RENDER_HEADER];
/** Headers that describe one transfer (or one visitor), never copied into a stored page. */
const NOT_STORED = new Set([
  'set-cookie',
  'content-length',
  'content-encoding',
  'transfer-encoding',
  'connection',
  'keep-alive',
  'date',
  'content-security-policy',
]);

export type StoredPage = { body: string; nonce: string; status: number; headers: [string, string][] };

/** Whether this request may be answered from the cache: a signed-out GET of a public page, no query. */
export function isPublicPageView(method: string, pathname: string, search: string, headers: Headers): boolean {
  if (method !== 'GET' || search !== '') return false;
  if (!PUBLIC_PATHS.some((p) => p.test(pathname))) return false;
  if (NOT_A_PAGE_VIEW.some((h) => headers.has(h))) return false;
  return !SESSION_COOKIE.test(headers.get('cookie') ?? '');
}

/** A stored page turned into a response with `nonce` in place of the one it was rendered with. */
export function respondWithNonce(page: StoredPage, nonce: string): Response {
  const swap = (text: string) => text.split(page.nonce).join(nonce);
  // The nonce is in the body's scripts and in headers too (Next's `Link: …; nonce=` preload).
  const headers = new Headers(page.headers.map(([name, value]): [string, string] => [name, swap(value)]));
  headers.set('content-security-policy', contentSecurityPolicy(nonce));
  return new Response(swap(page.body), { status: page.status, headers });
}

/**
 * Keeps a rendered page only when it is a plain 200 HTML page that sets no cookie and whose nonce
 * is known from its policy; anything else (404s, redirects, errors) is rendered every time.
 */
export async function storablePage(res: Response): Promise<StoredPage | null> {
  const nonce = nonceOf(res.headers.get('content-security-policy'));
  if (
    res.status !== 200 ||
    !nonce ||
    res.headers.has('set-cookie') ||
    !res.headers.get('content-type')?.startsWith('text/html')
  ) {
    await res.body?.cancel();
    return null;
  }
  const headers: [string, string][] = [];
  res.headers.forEach((value, name) => {
    if (!NOT_STORED.has(name)) headers.push([name, value]);
  });
  return { body: await res.text(), nonce, status: res.status, headers };
}

/** Pages by path for `ttlMs`, at most `maxEntries` (least recently used go first); one render per path at a time. */
export class PublicPageCache {
  private readonly pages = new Map<string, StoredPage & { expires: number }>();
  private readonly rendering = new Map<string, Promise<StoredPage | null>>();

  constructor(
    private readonly ttlMs: number,
    private readonly maxEntries = 200,
    private readonly now: () => number = Date.now,
  ) {}

  get enabled(): boolean {
    return this.ttlMs > 0;
  }

  /** The stored page, or `render()`'s (stored when it can be). Null when the page must be rendered as usual. */
  async get(key: string, render: () => Promise<StoredPage | null>): Promise<StoredPage | null> {
    const hit = this.pages.get(key);
    this.pages.delete(key);
    if (hit && hit.expires > this.now()) {
      this.pages.set(key, hit); // most recently used now
      return hit;
    }
    let pending = this.rendering.get(key);
    if (!pending) {
      pending = render()
        .then(
          (page) => {
            if (page) this.store(key, page);
            return page;
          },
          () => null,
        )
        .finally(() => this.rendering.delete(key));
      this.rendering.set(key, pending);
    }
    return pending;
  }

  private store(key: string, page: StoredPage): void {
    this.pages.set(key, { ...page, expires: this.now() + this.ttlMs });
    while (this.pages.size > this.maxEntries) this.pages.delete(this.pages.keys().next().value as string);
  }
}
