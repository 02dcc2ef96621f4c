'use client';
import Link from 'next/link';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { Chip } from '@/components/ui/chip';
import { formatWeight, type UnitSystem } from '@/lib/domain/units';
import type { Page } from '@/lib/schemas/list-query';
import type { PullRow } from '@/lib/data/super-pulls';
import { FlagCell } from './chips';

/** Pulled supers from /api/super-pulls, sorted and paged on the server; flagged ones show why. */
export function SuperPullTable({ initial, filters, weightSystem }: { initial: Page<PullRow>; filters: Record<string, string>; weightSystem: UnitSystem }) {
  const columns: DataColumn<PullRow>[] = [
    { id: 'pulledOn', header: 'Pulled', sortable: true, cell: (p) => p.pulledOn },
    { id: 'colony', header: 'Colony', sortable: true, cell: (p) => <Link href={`/admin/colonies/${p.colonyId}`}>{p.colonyCode}</Link> },
    { id: 'yard', header: 'Yard', cell: (p) => p.yardName },
    { id: 'box', header: 'Box', cell: (p) => `${p.depth}, ${p.frameCount} fr.` },
    { id: 'tag', header: 'Tag', cell: (p) => p.tagCode ?? '—' },
    { id: 'fullGrams', header: 'Full weight', numeric: true, sortable: true, cell: (p) => (p.fullGrams ? formatWeight(p.fullGrams, weightSystem) : p.cappedFrames != null ? `~${p.cappedFrames} capped fr.` : '—') },
    { id: 'flag', header: 'Conflict check', cell: (p) => <FlagCell flagged={p.flagged} reasons={p.flagReasons} /> },
    { id: 'lot', header: 'Lot', cell: (p) => (p.inLot ? <Chip tone="info">in a lot</Chip> : <Chip>waiting</Chip>) },
  ];
  return <DataTable endpoint="/api/super-pulls" columns={columns} caption="Super pulls" filters={filters} initial={initial} initialSort={{ id: 'pulledOn', desc: true }} pageSize={initial.pageSize} empty="No super pulls match." />;
}
