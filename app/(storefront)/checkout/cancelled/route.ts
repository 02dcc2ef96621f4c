import { appUrl } from '@/lib/config/app-url';
import { checkOrderToken } from '@/lib/payments/order-token';
import { cancelCheckout } from '@/lib/data/shop/checkout';

export const dynamic = 'force-dynamic';

/**
 * Stripe's cancel_url: the buyer left the payment page. The signed link lets us release the jars
 * at once (instead of after 30 minutes) and close the session, then back to the cart — on the
 * public address, not the host the request reached us on.
 */
export async function GET(req: Request): Promise<Response> {
  const url = new URL(req.url);
  const number = url.searchParams.get('order') ?? '';
  const back = `${appUrl()}/cart?cancelled=1`;
  if (checkOrderToken(number, url.searchParams.get('t'))) await cancelCheckout(number);
  return Response.redirect(back, 303);
}
