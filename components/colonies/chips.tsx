import { Chip } from '@/components/ui/chip';
import type { QueenMarkColour } from '@/lib/domain/queen-colour';

const STATUS: Record<string, { word: string; tone: 'ok' | 'warn' | 'bad' | 'neutral' }> = {
  active: { word: 'active', tone: 'ok' },
  dead_out: { word: 'dead-out', tone: 'bad' },
  combined: { word: 'combined', tone: 'neutral' },
  sold: { word: 'sold', tone: 'neutral' },
};

export function ColonyStatusChip({ status }: { status: string }) {
  const s = STATUS[status] ?? { word: status, tone: 'neutral' as const };
  return <Chip tone={s.tone}>{s.word}</Chip>;
}

const SWATCH: Record<QueenMarkColour, string> = {
  white: '#ffffff',
  yellow: '#f2d13a',
  red: '#c8322b',
  green: '#2f8a45',
  blue: '#2d5fb4',
};

/** The queen's marking colour: always the word, with a small dot of the colour beside it. */
export function QueenColour({ year, colour }: { year: number | null; colour: QueenMarkColour | null }) {
  if (!year || !colour) return <span className="hint">queen year not recorded</span>;
  return (
    <span className="inline-flex items-center gap-1.5">
      <span
        aria-hidden
        className="inline-block h-3 w-3 rounded-full border border-ink/40"
        style={{ backgroundColor: SWATCH[colour] }}
      />
      {year} · {colour}
    </span>
  );
}

/** A flagged super shows the word and every reason, not just a colour. */
export function FlagCell({ flagged, reasons }: { flagged: boolean; reasons: string[] }) {
  if (!flagged) return <Chip tone="ok">clear</Chip>;
  return (
    <div className="space-y-1">
      <Chip tone="bad">flagged</Chip>
      <ul className="list-disc pl-4 text-xs text-bad-fg">
        {reasons.map((r) => (
          <li key={r}>{r}</li>
        ))}
      </ul>
    </div>
  );
}
