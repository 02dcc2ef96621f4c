import { requirePermission } from '@/lib/auth/session';
import { listOrders } from '@/lib/data/orders/list';
import { getSettings } from '@/lib/data/settings/settings';
import { queryRecord } from '@/lib/schemas/list-query';
import { ORDER_DESK_FILTERS, orderListQuery, type OrderDeskFilter } from '@/lib/schemas/orders';
import { PageHeader } from '@/components/ui/page-header';
import { SelectField } from '@/components/ui/select-field';
import { STATUS_LABEL } from '@/components/orders/order-status-chip';
import { OrderDeskTable } from '@/components/orders/order-tables';

export const metadata = { title: 'Orders' };
export const dynamic = 'force-dynamic';

const label = (f: OrderDeskFilter) => (f === 'open' ? 'To pack and send' : f === 'all' ? 'All' : STATUS_LABEL(f));

export default async function OrdersDeskPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requirePermission('orders.desk', '/admin/orders');
  const parsed = orderListQuery.safeParse(queryRecord(await searchParams));
  const query = parsed.success ? parsed.data : orderListQuery.parse({});
  const [first, settings] = await Promise.all([listOrders(user, query), getSettings()]);
  const filters: Record<string, string> = { status: query.status };
  if (query.q) filters.q = query.q;
  return (
    <>
      <PageHeader title="Orders" lead="Paid orders to pack, ship or hand over; refunds and cancellations." />
      <form className="mb-4 flex flex-wrap items-end gap-3" action="/admin/orders">
        <SelectField
          id="status"
          name="status"
          label="Show"
          className="input w-auto"
          defaultValue={query.status}
          options={ORDER_DESK_FILTERS.map((f) => ({ value: f, label: label(f) }))}
        />
        <label className="field" htmlFor="q">
          <span>Order, name or e-mail</span>
          <input id="q" name="q" className="input" maxLength={80} defaultValue={query.q ?? ''} />
        </label>
        <button type="submit" className="btn-secondary">
          Filter
        </button>
      </form>
      <OrderDeskTable
        initial={first}
        filters={filters}
        initialSort={{ id: query.sort, desc: query.dir === 'desc' }}
        caption={`Orders: ${label(query.status)}`}
        timeZone={settings.timeZone}
      />
    </>
  );
}
