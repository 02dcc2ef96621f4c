'use client';
import Link from 'next/link';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { Chip } from '@/components/ui/chip';
import type { Page } from '@/lib/schemas/list-query';
import type { ColonyRow } from '@/lib/data/colonies/read';
import { ColonyStatusChip, QueenColour } from './chips';

/** Colonies from /api/colonies (scoped to the user's yards on the server). */
export function ColonyTable({
  initial,
  filters,
  caption,
}: {
  initial: Page<ColonyRow>;
  filters: Record<string, string>;
  caption: string;
}) {
  const columns: DataColumn<ColonyRow>[] = [
    {
      id: 'code',
      header: 'Colony',
      sortable: true,
      cell: (c) => (
        <Link className="inline-flex min-h-11 items-center font-semibold" href={`/admin/colonies/${c.id}`}>
          {c.code}
        </Link>
      ),
    },
    { id: 'status', header: 'Status', sortable: true, cell: (c) => <ColonyStatusChip status={c.status} /> },
    {
      id: 'queenYear',
      header: 'Queen',
      sortable: true,
      cell: (c) => <QueenColour year={c.queenYear} colour={c.queenColour} />,
    },
    { id: 'keeper', header: 'Keeper', cell: (c) => c.keeperName },
    { id: 'lastPull', header: 'Last pull', numeric: true, cell: (c) => c.lastPulledOn ?? '—' },
    {
      id: 'flags',
      header: 'Flags',
      cell: (c) =>
        c.flaggedSupers > 0 ? <Chip tone="bad">{c.flaggedSupers} flagged</Chip> : <span className="hint">none</span>,
    },
  ];
  return (
    <DataTable
      endpoint="/api/colonies"
      columns={columns}
      caption={caption}
      filters={filters}
      initial={initial}
      initialSort={{ id: 'code', desc: false }}
      empty="No colonies here yet."
    />
  );
}
