import { headers } from 'next/headers';
import { assertSameOrigin } from '@/lib/http/origin';
import { handleRouteError, readJson } from '@/lib/http/json';
import { currentUser } from '@/lib/auth/session';
import { checkoutInput } from '@/lib/schemas/checkout';
import { startCheckout } from '@/lib/data/shop/checkout';
import { clientIp } from '@/lib/http/client-ip';

export const dynamic = 'force-dynamic';

/** Starts a checkout: our prices, stock reserved, a Stripe Checkout Session; answers its URL. 409 = not enough jars, 429 = past the checkout limits. */
export async function POST(req: Request): Promise<Response> {
  try {
    const h = await headers();
    await assertSameOrigin(h);
    const input = checkoutInput.parse(await readJson(req, 50_000));
    const user = await currentUser();
    // The one source of the client's address (lib/http/client-ip.ts), for the checkout limits.
    const started = await startCheckout(input, user, clientIp(req.headers));
    return Response.json({ url: started.url, number: started.number }, { headers: { 'Cache-Control': 'no-store' } });
  } catch (err) {
    return handleRouteError(err);
  }
}
