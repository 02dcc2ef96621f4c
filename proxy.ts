import { NextResponse, type NextRequest } from 'next/server';
import { getToken } from 'next-auth/jwt';
import { contentSecurityPolicy, newNonce } from '@/lib/http/csp';
import { markForwardedHeaders } from '@/lib/http/client-ip';
import {
  PublicPageCache,
  RENDER_HEADER,
  isPublicPageView,
  respondWithNonce,
  storablePage,
} from '@/lib/http/public-page-cache';

const publicPages = new PublicPageCache(Number(process.env.PUBLIC_PAGE_CACHE_SECONDS ?? 5) * 1000);

/**
 * Where the proxy asks for a render of a public page. Never the request's Host header (a forged Host
 * would fill the cache from another server): APP_INTERNAL_URL, or the loopback port `next start` set.
 */
function internalOrigin(): string | null {
  if (process.env.APP_INTERNAL_URL) return process.env.APP_INTERNAL_URL.replace(/\/$/, '');
  return process.env.PORT ? `http://127.0.0.1:${process.env.PORT}` : null;
}

async function renderPublicPage(pathname: string) {
  const origin = internalOrigin();
  if (!origin) return null;
  const res = await fetch(`${origin}${pathname}`, {
    headers: { [RENDER_HEADER]: '1', accept: 'text/html', 'accept-encoding': 'identity' },
    cache: 'no-store',
    redirect: 'manual',
    signal: AbortSignal.timeout(10_000),
  });
  return storablePage(res);
}

/**
 * Runs before every page (not /api, not static files, not the icons and the web app manifest):
 * 1. A Content-Security-Policy with a fresh nonce per response (ASVS 3.4.3); Next puts the nonce on
 *    its own scripts when it sees the header on the request.
 * 2. Signed-out views of the public shop pages come from a few seconds' cache, each answer with its
 *    own fresh nonce (lib/http/public-page-cache.ts).
 * 3. Signed-out visitors to /admin go to sign-in. This is only a convenience: every page, action and
 *    route handler checks the user itself (lib/auth/session.ts).
 * 4. The client's address: a client's own X-Forwarded-For is moved aside so that Next fills the
 *    header from the socket, and the request is marked as seen here (lib/http/client-ip.ts). The
 *    sign-in throttle and the checkout limits read the address this way, so every /api route is
 *    matched for that (nothing else is done to API requests here).
 */
export async function proxy(req: NextRequest) {
  const { pathname, search } = req.nextUrl;
  if (pathname.startsWith('/api/')) {
    const headers = new Headers(req.headers);
    markForwardedHeaders(headers);
    return NextResponse.next({ request: { headers } });
  }
  if (pathname.startsWith('/admin')) {
    const token = await getToken({ req, secret: process.env.NEXTAUTH_SECRET });
    if (!token?.role || token.role === 'customer') {
      const url = new URL('/sign-in', req.url);
      url.searchParams.set('next', pathname + search);
      return NextResponse.redirect(url);
    }
  }

  const nonce = newNonce();
  if (publicPages.enabled && isPublicPageView(req.method, pathname, search, req.headers)) {
    const page = await publicPages.get(pathname, () => renderPublicPage(pathname));
    if (page) return respondWithNonce(page, nonce);
  }

  const csp = contentSecurityPolicy(nonce);
  const headers = new Headers(req.headers);
  markForwardedHeaders(headers);
  headers.set('Content-Security-Policy', csp);
  const res = NextResponse.next({ request: { headers } });
  res.headers.set('Content-Security-Policy', csp);
  return res;
}

export const config = {
  matcher: [
    { source: '/((?!api|_next/static|_next/image|favicon.ico|icons/|manifest.webmanifest).*)' },
    { source: '/api/:path*' },
  ],
};
