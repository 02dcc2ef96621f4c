'use client';
import Link from 'next/link';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { formatWeight, type UnitSystem } from '@/lib/domain/units';
import type { Page } from '@/lib/schemas/list-query';
import type { RunRow } from '@/lib/data/jarring/read';
import { RunStatus } from './run-status';

/** Jarring runs from /api/jarring, newest first; a failed fill check stands out with its reasons. */
export function RunsTable({
  initial,
  system,
  initialSort,
}: {
  initial: Page<RunRow>;
  system: UnitSystem;
  initialSort: { id: string; desc: boolean };
}) {
  const columns: DataColumn<RunRow>[] = [
    { id: 'run', header: 'Run', cell: (r) => <Link href={`/admin/jarring/${r.id}`}>#{r.id}</Link> },
    { id: 'runOn', header: 'Date', sortable: true, cell: (r) => <span className="whitespace-nowrap">{r.runOn}</span> },
    { id: 'lot', header: 'Lot', cell: (r) => <span className="whitespace-nowrap">{r.lotCode}</span> },
    { id: 'product', header: 'Product', cell: (r) => r.productName },
    { id: 'jars', header: 'Jars', numeric: true, cell: (r) => r.jarCount },
    { id: 'honey', header: 'Honey used', numeric: true, cell: (r) => formatWeight(r.honeyUsedGrams, system) },
    {
      id: 'check',
      header: 'Fill check',
      cell: (r) => (
        <>
          <RunStatus pass={r.pass} overridden={!!r.overrideReason} />
          {!r.pass ? (
            <ul className="mt-1 ml-4 list-disc text-xs text-bad-fg">
              {r.reasons.map((x) => (
                <li key={x}>{x}</li>
              ))}
            </ul>
          ) : null}
        </>
      ),
    },
  ];
  return (
    <DataTable
      endpoint="/api/jarring"
      columns={columns}
      caption="Jarring runs"
      initial={initial}
      initialSort={initialSort}
      empty="No runs yet."
      rowClassName={(r) => (r.pass ? undefined : 'bg-bad-bg')}
    />
  );
}
