import { getDb } from '@/lib/db';
import { checkOrderToken } from '@/lib/payments/order-token';
import { releaseOrder } from '@/lib/data/shop/checkout';
import { stripe } from '@/lib/payments/stripe';

export const dynamic = 'force-dynamic';

/**
 * Stripe's cancel_url: the buyer left the payment page. The signed link lets us release the jars
 * at once (instead of after 30 minutes) and close the session, then back to the cart.
 */
export async function GET(req: Request): Promise<Response> {
  const url = new URL(req.url);
  const number = url.searchParams.get('order') ?? '';
  const back = new URL('/cart?cancelled=1', url);
  if (!checkOrderToken(number, url.searchParams.get('t'))) return Response.redirect(back, 303);
  const order = await getDb().models.Order.findOne({ where: { number } });
  if (order && order.status === 'awaiting_payment') {
    if (order.stripeSessionId) await stripe().checkout.sessions.expire(order.stripeSessionId).catch(() => undefined);
    await releaseOrder(order.id, 'cancelled', null, 'The customer left the payment page');
  }
  return Response.redirect(back, 303);
}
