import Link from 'next/link';
import { notFound } from 'next/navigation';
import { currentUser } from '@/lib/auth/session';
import { getOrderForViewer } from '@/lib/data/orders/read';
import { getSettings } from '@/lib/data/settings/settings';
import { OrderStatusChip } from '@/components/orders/order-status-chip';
import { OrderLines } from '@/components/orders/order-lines';
import { ClearCart } from '@/components/shop/clear-cart';
import { Caution, INFANT_CAUTION } from '@/components/ui/caution';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Your order', referrer: 'no-referrer' };

type Props = { params: Promise<{ number: string }>; searchParams: Promise<{ t?: string; session_id?: string }> };

export default async function OrderPage({ params, searchParams }: Props) {
  const [{ number }, sp, user, settings] = await Promise.all([params, searchParams, currentUser(), getSettings()]);
  const order = await getOrderForViewer(number, user, sp.t ?? null);
  if (!order) notFound();
  const back = Boolean(sp.session_id);
  const waiting = back && order.status === 'awaiting_payment';
  return (
    <div className="space-y-6">
      {/* Back from the payment page: the webhook may be a moment behind, so look again shortly. */}
      {waiting ? <meta httpEquiv="refresh" content="2" /> : null}
      {back ? <ClearCart /> : null}
      <div className="flex flex-wrap items-center gap-3">
        <h1>Order {order.number}</h1>
        <OrderStatusChip status={order.status} />
      </div>
      {waiting ? <p role="status">We are confirming your payment…</p> : null}
      {order.status === 'paid' ? (
        <p role="status">Thank you! Your payment was received and a confirmation is on its way to {order.email}.</p>
      ) : null}
      {order.status === 'awaiting_payment' && !back ? <p>This order has not been paid yet.</p> : null}
      {order.status === 'expired' || order.status === 'cancelled' ? (
        <p>This order was not paid in time and its jars went back on the shelf.</p>
      ) : null}
      <OrderLines order={order} />
      <section className="space-y-1 card text-sm">
        <h2 className="text-lg">{order.fulfilment === 'pickup' ? 'Pickup' : 'Delivery'}</h2>
        {order.fulfilment === 'pickup' ? (
          <p>At the honey house{settings.address ? `: ${settings.address}` : ''}. We e-mail you when it is ready.</p>
        ) : (
          <p>
            {[
              order.shippingAddress?.line1,
              order.shippingAddress?.line2,
              order.shippingAddress?.city,
              order.shippingAddress?.postalCode,
              order.shippingAddress?.country,
            ]
              .filter(Boolean)
              .join(', ')}
          </p>
        )}
        {order.tracking ? <p>Tracking: {order.tracking}</p> : null}
      </section>
      <p className="hint">The lot code on each jar shows where its honey came from.</p>
      <Caution title="Food safety">{INFANT_CAUTION}</Caution>
      {user?.role === 'customer' ? (
        <p>
          <Link href="/account">All your orders</Link>
        </p>
      ) : null}
    </div>
  );
}
