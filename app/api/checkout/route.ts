import { headers } from 'next/headers';
import { assertSameOrigin } from '@/lib/http/origin';
import { handleRouteError, readJson } from '@/lib/http/json';
import { currentUser } from '@/lib/auth/session';
import { checkoutInput } from '@/lib/schemas/checkout';
import { startCheckout } from '@/lib/data/shop/checkout';

export const dynamic = 'force-dynamic';

/** Starts a checkout: our prices, stock reserved, a Stripe Checkout Session; answers its URL. 409 = not enough jars. */
export async function POST(req: Request): Promise<Response> {
  try {
    await assertSameOrigin(await headers());
    const input = checkoutInput.parse(await readJson(req, 50_000));
    const user = await currentUser();
    const started = await startCheckout(input, user);
    return Response.json({ url: started.url, number: started.number }, { headers: { 'Cache-Control': 'no-store' } });
  } catch (err) {
    return handleRouteError(err);
  }
}
