/**
 * Where to send a person after signing in. `next` comes from the query string, so anyone can write
 * it: it is resolved against our own origin with the URL parser (the same parser the browser uses,
 * so `/\host`, `/<TAB>/host` and the like are read the way the browser would read them) and kept only
 * when the origin is unchanged and the path is one of our pages. Anything else gets `fallback`
 * (the role's home). The answer is always a path that starts with one `/`, never a URL.
 * OWASP Unvalidated Redirects and Forwards Cheat Sheet; ASVS 5.0 V3.7.2 (from memory).
 */
const BASE = 'http://combtrace.invalid';

export function safeRedirectPath(next: unknown, fallback = '/welcome'): string {
  if (typeof next !== 'string' || next === '' || next.length > 2000) return fallback;
  // Only a path of ours: no scheme, no authority, nothing the parser would strip silently.
  if (!next.startsWith('/') || /[\u0000-\u001f\u007f\\]/.test(next)) return fallback;
  let url: URL;
  try {
    url = new URL(next, BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== BASE) return fallback;
  const path = url.pathname + url.search + url.hash;
  // After normalising, the path must still be a path (`/.//host` becomes `//host`, a new origin).
  if (!path.startsWith('/') || path.startsWith('//') || /^\/[\\/]/.test(decodeSafe(url.pathname))) return fallback;
  // Our own pages only: never an API route or a build file.
  if (/^\/(api|_next)(\/|$)/i.test(url.pathname)) return fallback;
  return path;
}

function decodeSafe(s: string): string {
  try {
    return decodeURIComponent(s);
  } catch {
    return s;
  }
}

/**
 * next-auth's redirect callback: a relative or same-origin URL stays (as an absolute URL on our
 * origin), anything else goes to the signed-in home.
 */
export function safeAuthRedirect(url: string, baseUrl: string, fallback = '/welcome'): string {
  const base = new URL(baseUrl);
  let candidate = url;
  if (!url.startsWith('/')) {
    try {
      const parsed = new URL(url);
      if (parsed.origin !== base.origin) return new URL(fallback, base).toString();
      candidate = parsed.pathname + parsed.search + parsed.hash;
    } catch {
      return new URL(fallback, base).toString();
    }
  }
  // Paths under a base path (NEXTAUTH_URL with a path) are left as they are.
  return new URL(safeRedirectPath(candidate, fallback), base.origin).toString();
}
