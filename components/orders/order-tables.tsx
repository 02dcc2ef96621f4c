'use client';
import Link from 'next/link';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { formatMoney } from '@/lib/domain/units';
import { formatDateTime } from '@/lib/domain/order-dates';
import type { Page } from '@/lib/schemas/list-query';
import type { OrderListRow } from '@/lib/data/orders/list';
import { OrderStatusChip } from './order-status-chip';

const money = (cents: number, o: OrderListRow) => formatMoney(cents, o.currency.toUpperCase());

/** The order desk from /api/orders: newest first, filtered by status and search on the server. */
export function OrderDeskTable({
  initial,
  filters,
  initialSort,
  caption,
  timeZone,
}: {
  initial: Page<OrderListRow>;
  filters: Record<string, string>;
  initialSort: { id: string; desc: boolean };
  caption: string;
  timeZone: string;
}) {
  const columns: DataColumn<OrderListRow>[] = [
    { id: 'number', header: 'Order', cell: (o) => <Link href={`/admin/orders/${o.id}`}>{o.number}</Link> },
    { id: 'createdAt', header: 'Placed', sortable: true, cell: (o) => formatDateTime(new Date(o.createdAt), timeZone) },
    {
      id: 'customer',
      header: 'Customer',
      cell: (o) => (
        <>
          {o.name}
          <div className="hint break-all">{o.email}</div>
        </>
      ),
    },
    { id: 'status', header: 'Status', cell: (o) => <OrderStatusChip status={o.status} needsRefund={o.needsRefund} /> },
    { id: 'how', header: 'How', cell: (o) => (o.fulfilment === 'ship' ? 'Ship' : 'Pickup') },
    { id: 'jars', header: 'Jars', numeric: true, cell: (o) => o.jars },
    {
      id: 'totalCents',
      header: 'Total',
      numeric: true,
      sortable: true,
      cell: (o) => (
        <>
          {money(o.totalCents, o)}
          {o.refundedCents > 0 ? <div className="hint">−{money(o.refundedCents, o)} refunded</div> : null}
        </>
      ),
    },
  ];
  return (
    <DataTable
      key={JSON.stringify(filters)}
      endpoint="/api/orders"
      columns={columns}
      caption={caption}
      filters={filters}
      initial={initial}
      initialSort={initialSort}
      empty="No orders here."
    />
  );
}

/** A customer's own orders from /api/account/orders, newest first. */
export function AccountOrdersTable({ initial, timeZone }: { initial: Page<OrderListRow>; timeZone: string }) {
  const columns: DataColumn<OrderListRow>[] = [
    { id: 'number', header: 'Order', cell: (o) => <Link href={`/orders/${o.number}`}>{o.number}</Link> },
    {
      id: 'createdAt',
      header: 'Placed',
      sortable: true,
      cell: (o) => formatDateTime(new Date(o.createdAt), timeZone, false),
    },
    { id: 'status', header: 'Status', cell: (o) => <OrderStatusChip status={o.status} /> },
    { id: 'jars', header: 'Jars', numeric: true, cell: (o) => o.jars },
    { id: 'total', header: 'Total', numeric: true, cell: (o) => money(o.totalCents, o) },
  ];
  return (
    <DataTable
      endpoint="/api/account/orders"
      columns={columns}
      caption="Your orders"
      initial={initial}
      initialSort={{ id: 'createdAt', desc: true }}
    />
  );
}
