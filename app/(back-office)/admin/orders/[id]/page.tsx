import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { getOrderDetail } from '@/lib/data/orders/read';
import { getSettings } from '@/lib/data/settings/settings';
import { listAudit } from '@/lib/data/audit';
import { currencyMinorDigits, formatMoney } from '@/lib/domain/units';
import { formatDateTime } from '@/lib/domain/order-dates';
import { PageHeader } from '@/components/ui/page-header';
import { Caution } from '@/components/ui/caution';
import { OrderStatusChip } from '@/components/orders/order-status-chip';
import { OrderLines } from '@/components/orders/order-lines';
import { OrderDeskActions } from '@/components/orders/order-desk-actions';
import {
  cancelOrderAction,
  markPackedAction,
  markPickedUpAction,
  markShippedAction,
  refundOrderAction,
} from '../actions';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Order' };

export default async function OrderDeskPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission('orders.desk', `/admin/orders/${id}`);
  const orderId = Number(id);
  const order = Number.isInteger(orderId) && orderId > 0 ? await getOrderDetail(orderId) : null;
  if (!order) notFound();
  const [settings, history] = await Promise.all([getSettings(), listAudit('order', order.id, 50)]);
  const when = (d: Date | null) => (d ? formatDateTime(d, settings.timeZone) : '—');
  const digits = currencyMinorDigits(order.currency);
  const a = order.shippingAddress;
  return (
    <>
      <PageHeader
        title={`Order ${order.number}`}
        lead={
          <>
            <OrderStatusChip status={order.status} needsRefund={order.needsRefund} />{' '}
            <span className="ml-2">{order.fulfilment === 'ship' ? 'Ship' : 'Pickup at the honey house'}</span>
          </>
        }
        actions={
          <>
            <Link className="btn-secondary no-underline" href="/admin/orders">
              All orders
            </Link>
            {order.lines.some((l) => l.lots.length) ? (
              <a className="btn-secondary no-underline" href={`/admin/orders/${order.id}/packing-slip`}>
                Packing slip (PDF)
              </a>
            ) : null}
          </>
        }
      />
      {order.needsRefund ? (
        <Caution title="Refund needed">
          This order was paid after its reservation ended and there were not enough jars left. Refund the payment below.
        </Caution>
      ) : null}
      <div className="grid gap-6 xl:grid-cols-[1fr_24rem]">
        <div className="space-y-6">
          <div className="overflow-x-auto card p-0">
            <OrderLines order={order} />
          </div>
          <section className="card">
            <h2 className="mb-2 text-lg">History</h2>
            <ul className="space-y-1 text-sm">
              {history.length === 0 ? <li className="text-ink-soft">No changes recorded yet.</li> : null}
              {history.map((h) => (
                <li key={h.id}>
                  {formatDateTime(h.createdAt, settings.timeZone)} —{' '}
                  {h.action.replace('order.', '').replaceAll('_', ' ')}
                  {h.actorName ? ` by ${h.actorName}` : ''}
                  {h.reason ? `: ${h.reason}` : ''}
                </li>
              ))}
            </ul>
          </section>
        </div>
        <div className="space-y-6">
          <section className="space-y-1 card text-sm">
            <h2 className="text-lg">Customer</h2>
            <p>{order.name}</p>
            <p className="break-all">{order.email}</p>
            {order.phone ? <p>{order.phone}</p> : null}
            {a ? (
              <p>{[a.line1, a.line2, a.city, a.region, a.postalCode, a.country].filter(Boolean).join(', ')}</p>
            ) : null}
            <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3">
              <dt>Placed</dt>
              <dd>{when(order.createdAt)}</dd>
              <dt>Paid</dt>
              <dd>{when(order.paidAt)}</dd>
              <dt>Packed</dt>
              <dd>{when(order.packedAt)}</dd>
              {order.fulfilment === 'ship' ? (
                <>
                  <dt>Shipped</dt>
                  <dd>
                    {when(order.shippedAt)}
                    {order.tracking ? ` · ${order.tracking}` : ''}
                  </dd>
                </>
              ) : (
                <>
                  <dt>Picked up</dt>
                  <dd>{when(order.pickedUpAt)}</dd>
                </>
              )}
              {order.refundedCents > 0 ? (
                <>
                  <dt>Refunded</dt>
                  <dd>{formatMoney(order.refundedCents, order.currency.toUpperCase())}</dd>
                </>
              ) : null}
            </dl>
          </section>
          <section className="card">
            <h2 className="mb-3 text-lg">Next step</h2>
            {order.paidAt && !order.paymentIntentId ? (
              <p className="mb-3 hint">Paid outside the card checkout: refund it by hand.</p>
            ) : null}
            <OrderDeskActions
              order={{
                id: order.id,
                status: order.status,
                fulfilment: order.fulfilment,
                paid: Boolean(order.paidAt && order.paymentIntentId),
                refundableCents: order.totalCents - order.refundedCents,
                currencyDigits: digits,
                currency: order.currency,
              }}
              lines={order.lines.map((l) => ({
                id: l.id,
                name: l.productName,
                sold: l.lots.filter((x) => x.state === 'sold').reduce((s, x) => s + x.quantity, 0),
              }))}
              canRefund={can(user.role, 'orders.refund')}
              actions={{
                packed: markPackedAction,
                pickedUp: markPickedUpAction,
                cancel: cancelOrderAction,
                shipped: markShippedAction,
                refund: refundOrderAction,
              }}
            />
          </section>
        </div>
      </div>
    </>
  );
}
