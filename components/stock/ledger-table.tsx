'use client';
import Link from 'next/link';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import type { Page } from '@/lib/schemas/list-query';
import type { LedgerRow } from '@/lib/data/stock/stock';

const KIND_NAMES = {
  jarring: 'jarring run',
  order: 'order',
  breakage: 'breakage',
  adjustment: 'adjustment',
  return: 'return',
} as const;

/** The stock ledger from /api/stock/ledger, newest entry first unless sorted otherwise. */
export function LedgerTable({
  initial,
  filters,
  initialSort,
}: {
  initial: Page<LedgerRow>;
  filters: Record<string, string>;
  initialSort: { id: string; desc: boolean };
}) {
  const columns: DataColumn<LedgerRow>[] = [
    {
      id: 'createdAt',
      header: 'When',
      sortable: true,
      cell: (r) => <span className="whitespace-nowrap">{r.createdAt.slice(0, 16).replace('T', ' ')}</span>,
    },
    { id: 'product', header: 'Product', cell: (r) => r.productName },
    { id: 'lot', header: 'Lot', cell: (r) => <span className="whitespace-nowrap">{r.lotCode}</span> },
    { id: 'delta', header: 'Change', numeric: true, cell: (r) => (r.delta > 0 ? `+${r.delta}` : r.delta) },
    {
      id: 'kind',
      header: 'Kind',
      cell: (r) => (
        <span className="whitespace-nowrap">
          {r.jarringRunId ? (
            <Link href={`/admin/jarring/${r.jarringRunId}`}>{KIND_NAMES[r.kind]}</Link>
          ) : r.orderId ? (
            `${KIND_NAMES[r.kind]} #${r.orderId}`
          ) : (
            KIND_NAMES[r.kind]
          )}
        </span>
      ),
    },
    { id: 'reason', header: 'Reason', cell: (r) => r.reason },
    { id: 'by', header: 'By', cell: (r) => r.byName ?? '—' },
  ];
  return (
    <DataTable
      endpoint="/api/stock/ledger"
      columns={columns}
      caption="Stock ledger"
      filters={filters}
      initial={initial}
      initialSort={initialSort}
      empty="No entries."
    />
  );
}
