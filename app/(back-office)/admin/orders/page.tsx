import Link from 'next/link';
import { requirePermission } from '@/lib/auth/session';
import { DESK_PAGE_SIZE, listOrders } from '@/lib/data/orders/read';
import { getSettings } from '@/lib/data/settings/settings';
import { formatMoney } from '@/lib/domain/units';
import { formatDateTime } from '@/lib/domain/order-dates';
import { ORDER_STATUSES, type OrderStatus } from '@/lib/domain/order-status';
import { PageHeader } from '@/components/ui/page-header';
import { OrderStatusChip, STATUS_LABEL } from '@/components/orders/order-status-chip';

export const metadata = { title: 'Orders' };
export const dynamic = 'force-dynamic';

type Filter = OrderStatus | 'open' | 'all';
const FILTERS: Filter[] = ['open', 'all', ...ORDER_STATUSES];
const label = (f: Filter) => (f === 'open' ? 'To pack and send' : f === 'all' ? 'All' : STATUS_LABEL(f));

export default async function OrdersDeskPage({ searchParams }: { searchParams: Promise<{ status?: string; page?: string; q?: string }> }) {
  await requirePermission('orders.desk', '/admin/orders');
  const sp = await searchParams;
  const status: Filter = (FILTERS as string[]).includes(sp.status ?? '') ? (sp.status as Filter) : 'open';
  const page = Math.max(1, Math.floor(Number(sp.page) || 1));
  const q = (sp.q ?? '').trim().slice(0, 80);
  const [{ rows, total }, settings] = await Promise.all([listOrders({ status, page, q }), getSettings()]);
  const pages = Math.max(1, Math.ceil(total / DESK_PAGE_SIZE));
  const href = (p: Partial<{ status: Filter; page: number }>) => {
    const u = new URLSearchParams({ status: p.status ?? status, page: String(p.page ?? 1) });
    if (q) u.set('q', q);
    return `/admin/orders?${u}`;
  };
  return (
    <>
      <PageHeader title="Orders" lead="Paid orders to pack, ship or hand over; refunds and cancellations." />
      <form className="mb-4 flex flex-wrap items-end gap-3" action="/admin/orders">
        <label className="field" htmlFor="status">
          <span>Show</span>
          <select id="status" name="status" className="input w-auto" defaultValue={status}>
            {FILTERS.map((f) => <option key={f} value={f}>{label(f)}</option>)}
          </select>
        </label>
        <label className="field" htmlFor="q">
          <span>Order, name or e-mail</span>
          <input id="q" name="q" className="input" defaultValue={q} />
        </label>
        <button type="submit" className="btn-secondary">Filter</button>
      </form>
      <div className="card overflow-x-auto p-0">
        <table className="data-table">
          <caption className="sr-only">Orders: {label(status)}</caption>
          <thead><tr><th scope="col">Order</th><th scope="col">Placed</th><th scope="col">Customer</th><th scope="col">Status</th><th scope="col">How</th><th scope="col" className="num">Jars</th><th scope="col" className="num">Total</th></tr></thead>
          <tbody>
            {rows.length === 0 ? <tr><td colSpan={7} className="text-ink-soft">No orders here.</td></tr> : null}
            {rows.map((o) => (
              <tr key={o.id}>
                <td><Link href={`/admin/orders/${o.id}`}>{o.number}</Link></td>
                <td>{formatDateTime(o.createdAt, settings.timeZone)}</td>
                <td>{o.name}<div className="hint break-all">{o.email}</div></td>
                <td><OrderStatusChip status={o.status} needsRefund={o.needsRefund} /></td>
                <td>{o.fulfilment === 'ship' ? 'Ship' : 'Pickup'}</td>
                <td className="num">{o.jars}</td>
                <td className="num">{formatMoney(o.totalCents, o.currency.toUpperCase())}{o.refundedCents > 0 ? <div className="hint">−{formatMoney(o.refundedCents, o.currency.toUpperCase())} refunded</div> : null}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <nav aria-label="Pages" className="mt-4 flex items-center gap-3 text-sm">
        {page > 1 ? <Link className="btn-quiet" href={href({ page: page - 1 })}>Previous</Link> : null}
        <span>Page {page} of {pages} · {total} order{total === 1 ? '' : 's'}</span>
        {page < pages ? <Link className="btn-quiet" href={href({ page: page + 1 })}>Next</Link> : null}
      </nav>
    </>
  );
}
