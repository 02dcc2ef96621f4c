'use client';
import Link from 'next/link';
import { MapPin } from 'lucide-react';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import type { Page } from '@/lib/schemas/list-query';
import type { YardRow } from '@/lib/data/yards/yards';

/** Yards from /api/yards (a keeper's own yards only, decided on the server), sorted and paged there. */
export function YardTable({
  initial,
  filters,
  initialSort,
  caption,
  empty,
}: {
  initial: Page<YardRow>;
  filters: Record<string, string>;
  initialSort: { id: string; desc: boolean };
  caption: string;
  empty: string;
}) {
  const columns: DataColumn<YardRow>[] = [
    {
      id: 'name',
      header: 'Yard',
      sortable: true,
      cell: (y) => (
        <Link href={`/admin/yards/${y.id}`} className="inline-flex min-h-11 items-center gap-2 font-semibold">
          <MapPin aria-hidden className="h-4 w-4 shrink-0" />
          {y.name}
        </Link>
      ),
    },
    { id: 'place', header: 'Place', cell: (y) => y.place || '—' },
    { id: 'colonies', header: 'Active colonies', numeric: true, sortable: true, cell: (y) => y.activeColonies },
    {
      id: 'keepers',
      header: 'Keepers',
      cell: (y) => y.keepers.map((k) => k.name).join(', ') || <span className="hint">no keeper assigned</span>,
    },
  ];
  return (
    <DataTable
      endpoint="/api/yards"
      columns={columns}
      caption={caption}
      filters={filters}
      initial={initial}
      initialSort={initialSort}
      empty={empty}
    />
  );
}
