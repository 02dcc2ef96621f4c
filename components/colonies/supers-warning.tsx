'use client';
import { TriangleAlert } from 'lucide-react';

export type SuperWarningView = { supers: { id: number; label: string }[]; reason: string };

/**
 * Supers on the hive during a sugar feeding, or during a treatment whose label does not allow
 * them: named before anything is saved, with the two ways on. The label and local law govern.
 */
export function SupersWarning({
  what,
  warning,
  busy,
  onTakeOff,
  onMark,
}: {
  what: 'feeding' | 'treatment';
  warning: SuperWarningView;
  busy: boolean;
  onTakeOff: () => void;
  onMark: () => void;
}) {
  const n = warning.supers.length;
  return (
    <div role="alert" aria-label="Supers on the hive" className="space-y-2 caution">
      <p className="flex gap-2 font-semibold">
        <TriangleAlert aria-hidden className="mt-0.5 h-5 w-5 shrink-0" />
        {n === 1 ? 'A honey super is' : `${n} honey supers are`} on this hive:{' '}
        {warning.supers.map((s) => s.label).join(', ')}.
      </p>
      <p className="text-sm">
        {what === 'feeding'
          ? 'Sugar fed now can end up in the honey of these supers.'
          : 'The label of this treatment does not allow honey supers on during it or its waiting period.'}{' '}
        Follow the product label and your local law. Take the supers off first, or save and mark them: marked supers are
        flagged and go into a lot only when the owner overrides the flag with a reason.
      </p>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn-secondary min-h-11" disabled={busy} onClick={onTakeOff}>
          Take them off first
        </button>
        <button type="button" className="btn-danger min-h-11" disabled={busy} onClick={onMark}>
          {what === 'feeding' ? 'Save the feeding and mark the supers' : 'Confirm: save and mark the supers'}
        </button>
      </div>
    </div>
  );
}

/** The confirmation after saving over supers (a queued entry or "mark them"). */
export function markedMessage(what: 'feeding' | 'treatment', warning: SuperWarningView | null): string {
  if (!warning) return 'Saved.';
  return `Saved the ${what}. Marked as flagged: ${warning.supers.map((s) => s.label).join(', ')}.`;
}
