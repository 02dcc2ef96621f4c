'use client';
import { useState } from 'react';
import type { ActionResult } from '@/lib/schemas/result';
import type { EmptyWeightInput, WaxInput } from '@/lib/schemas/lots';

/** One weight in kg or lb (a super's empty weight, the cappings wax): small enough for a table row. */
export function WeightFieldForm({ id, label, unit, button, onSave }: { id: string; label: string; unit: 'kg' | 'lb'; button: string; onSave: (value: number, unit: 'kg' | 'lb') => Promise<ActionResult> }) {
  const [value, setValue] = useState('');
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const n = Number(value.replace(',', '.'));
    if (!value || !Number.isFinite(n) || n < 0) return setError('Enter a weight.');
    setBusy(true);
    const result = await onSave(n, unit);
    setBusy(false);
    if (result.ok) { setValue(''); setError(undefined); } else setError(result.message ?? Object.values(result.fieldErrors ?? {})[0]);
  }
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-1" noValidate>
      <label className="field w-28" htmlFor={id}><span className="sr-only">{label}</span>
        <input id={id} className="input min-h-9 py-1" inputMode="decimal" placeholder={unit} value={value} onChange={(e) => setValue(e.target.value)} aria-label={label} aria-invalid={error ? true : undefined} /></label>
      <button type="submit" className="btn-quiet min-h-9 px-2 py-1" disabled={busy}>{button}</button>
      {error ? <small className="field-error w-full" role="alert">{error}</small> : null}
    </form>
  );
}

export function EmptyWeightForm({ lotId, superPullId, tag, unit, onSave }: { lotId: number; superPullId: number; tag: string; unit: 'kg' | 'lb'; onSave: (v: EmptyWeightInput) => Promise<ActionResult> }) {
  return <WeightFieldForm id={`empty-${superPullId}`} label={`Empty weight of super ${tag}, ${unit}`} unit={unit} button="Save" onSave={(empty, u) => onSave({ lotId, superPullId, empty, unit: u })} />;
}

export function WaxForm({ lotId, unit, onSave }: { lotId: number; unit: 'kg' | 'lb'; onSave: (v: WaxInput) => Promise<ActionResult> }) {
  return <WeightFieldForm id="wax" label={`Cappings wax, ${unit}`} unit={unit} button="Record wax" onSave={(wax, u) => onSave({ lotId, wax, unit: u })} />;
}
