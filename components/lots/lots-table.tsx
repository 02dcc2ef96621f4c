'use client';
import Link from 'next/link';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { formatWeight, type UnitSystem } from '@/lib/domain/units';
import type { LotListRow } from '@/lib/data/lots/lots';
import type { Page } from '@/lib/schemas/list-query';
import { StageChip } from './stage-chip';

/** The lot list: server-paginated and sorted through /api/lots. */
export function LotsTable({
  initial,
  filters,
  weightSystem,
}: {
  initial: Page<LotListRow>;
  filters: Record<string, string>;
  weightSystem: UnitSystem;
}) {
  const w = (g: number) => formatWeight(g, weightSystem);
  const columns: DataColumn<LotListRow>[] = [
    {
      id: 'code',
      header: 'Lot',
      sortable: true,
      cell: (l) => (
        <>
          <Link href={`/admin/lots/${l.id}`} className="font-mono font-semibold">
            {l.code}
          </Link>
          {l.isBlend ? <span className="hint"> · blend</span> : null}
        </>
      ),
    },
    { id: 'floralSource', header: 'Floral source', cell: (l) => l.floralSource || '—' },
    { id: 'stage', header: 'Stage', cell: (l) => <StageChip stage={l.stage} /> },
    { id: 'extractedOn', header: 'Extracted', sortable: true, cell: (l) => l.extractedOn ?? '—' },
    { id: 'superCount', header: 'Supers', numeric: true, cell: (l) => l.superCount },
    { id: 'netGrams', header: 'Net', numeric: true, sortable: true, cell: (l) => w(l.netGrams) },
    { id: 'remaining', header: 'Left', numeric: true, cell: (l) => w(l.remainingGrams) },
  ];
  return (
    <DataTable<LotListRow>
      key={JSON.stringify(filters)}
      endpoint="/api/lots"
      columns={columns}
      caption="Extraction lots"
      filters={filters}
      initial={initial}
      initialSort={{ id: 'createdAt', desc: true }}
      empty="No lots match."
    />
  );
}
