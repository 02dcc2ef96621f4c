import NextAuth from 'next-auth';
import { NextRequest } from 'next/server';
import { readBodyLimited } from '@/lib/http/body';
import { handleRouteError } from '@/lib/http/json';
import { authOptions } from '@/lib/auth/options';
import { appUrl } from '@/lib/config/app-url';
import { isThrottled } from '@/lib/data/auth/sign-in';
import { clientIp } from '@/lib/http/client-ip';

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

export function GET(req: Request, ctx: Ctx) {
  return handler(req, ctx);
}

/**
 * Sign-in attempts past the limit get 429 with the same generic message before any password is
 * checked (ASVS 6.3.1). next-auth's client reads the error from the returned URL.
 */
export async function POST(req: Request, ctx: Ctx) {
  // Sign-in, sign-out and CSRF posts are a few hundred bytes: read at most 16 KB while it streams.
  let bytes: Uint8Array;
  try {
    bytes = await readBodyLimited(req, 16_000);
  } catch (err) {
    return handleRouteError(err);
  }
  const body = () =>
    new NextRequest(req.url, {
      method: req.method,
      headers: req.headers,
      body: bytes.byteLength ? (bytes as BodyInit) : null,
    });
  if (new URL(req.url).pathname.endsWith('/callback/credentials')) {
    const form = await body()
      .formData()
      .catch(() => null);
    const email = String(form?.get('email') ?? '')
      .trim()
      .toLowerCase()
      .slice(0, 254);
    if (await isThrottled(email, clientIp(req.headers))) {
      return Response.json(
        { url: `${appUrl()}/sign-in?error=Throttled`, error: 'Too many attempts. Wait a few minutes, then try again.' },
        { status: 429 },
      );
    }
  }
  return handler(body(), ctx);
}
