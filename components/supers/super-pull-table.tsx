'use client';
import { useState } from 'react';
import Link from 'next/link';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { Chip } from '@/components/ui/chip';
import { formatWeight, type UnitSystem } from '@/lib/domain/units';
import { localDate } from '@/lib/domain/local-date';
import type { Page } from '@/lib/schemas/list-query';
import type { PullRow, PullVoid } from '@/lib/data/supers/pulls';
import { FlagCell } from '@/components/colonies/chips';
import { VoidedNote, VoidPullButton, type VoidPull } from './void-pull-button';

/**
 * Pulled supers from /api/super-pulls, sorted and paged on the server; flagged ones show why.
 * A voided pull stays listed, struck through, with who voided it, when and why. With `onVoid`
 * (owner and keepers) a standing pull not yet in a lot can be voided from its row.
 */
export function SuperPullTable({
  initial,
  filters,
  weightSystem,
  timeZone,
  onVoid,
}: {
  initial: Page<PullRow>;
  filters: Record<string, string>;
  weightSystem: UnitSystem;
  timeZone: string;
  onVoid?: VoidPull;
}) {
  // Voided from this page: shown at once, without waiting for the list to be fetched again.
  const [voidedHere, setVoidedHere] = useState<Record<number, PullVoid>>({});
  const voidOf = (p: PullRow) => p.voided ?? voidedHere[p.id] ?? null;
  const struck = (p: PullRow, content: React.ReactNode) =>
    voidOf(p) ? <s className="text-ink-soft">{content}</s> : content;
  const what = (p: PullRow) =>
    `the pull of ${p.tagCode ? `super ${p.tagCode}` : 'a super'} from ${p.colonyCode} on ${p.pulledOn}`;
  const columns: DataColumn<PullRow>[] = [
    { id: 'pulledOn', header: 'Pulled', sortable: true, cell: (p) => struck(p, p.pulledOn) },
    {
      id: 'colony',
      header: 'Colony',
      sortable: true,
      cell: (p) => <Link href={`/admin/colonies/${p.colonyId}`}>{struck(p, p.colonyCode)}</Link>,
    },
    { id: 'yard', header: 'Yard', cell: (p) => p.yardName },
    { id: 'box', header: 'Box', cell: (p) => struck(p, `${p.depth}, ${p.frameCount} fr.`) },
    { id: 'tag', header: 'Tag', cell: (p) => struck(p, p.tagCode ?? '—') },
    {
      id: 'fullGrams',
      header: 'Full weight',
      numeric: true,
      sortable: true,
      cell: (p) =>
        struck(
          p,
          p.fullGrams
            ? formatWeight(p.fullGrams, weightSystem)
            : p.cappedFrames != null
              ? `~${p.cappedFrames} capped fr.`
              : '—',
        ),
    },
    { id: 'flag', header: 'Conflict check', cell: (p) => <FlagCell flagged={p.flagged} reasons={p.flagReasons} /> },
    {
      id: 'lot',
      header: 'Lot',
      cell: (p) => {
        const v = voidOf(p);
        if (v)
          return (
            <div className="flex max-w-64 flex-col items-start gap-1">
              <Chip tone="warn">voided</Chip>
              <VoidedNote v={v} date={localDate(new Date(v.at), timeZone)} />
            </div>
          );
        if (p.inLot) return <Chip tone="info">in a lot</Chip>;
        return (
          <div className="flex flex-col items-start gap-1">
            <Chip>waiting</Chip>
            {onVoid ? (
              <VoidPullButton
                superPullId={p.id}
                what={what(p)}
                onVoid={onVoid}
                onVoided={(v2) => setVoidedHere((m) => ({ ...m, [p.id]: v2 }))}
              />
            ) : null}
          </div>
        );
      },
    },
  ];
  return (
    <DataTable
      endpoint="/api/super-pulls"
      columns={columns}
      caption="Super pulls"
      filters={filters}
      initial={initial}
      initialSort={{ id: 'pulledOn', desc: true }}
      empty="No super pulls match."
    />
  );
}
