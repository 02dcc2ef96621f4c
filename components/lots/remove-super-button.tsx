'use client';
import { useState } from 'react';
import type { ActionResult } from '@/lib/schemas/result';
import type { RemoveSuperInput } from '@/lib/schemas/lots';

/** Takes a super back out of a lot that is still gathering, with a written reason (audited). */
export function RemoveSuperButton({ lotId, superPullId, tag, onRemove }: { lotId: number; superPullId: number; tag: string; onRemove: (v: RemoveSuperInput) => Promise<ActionResult> }) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string>();
  if (!open) return <button type="button" className="btn-quiet min-h-0 px-2 py-1" onClick={() => setOpen(true)}>Take out<span className="sr-only"> super {tag}</span></button>;
  async function confirm() {
    const result = await onRemove({ lotId, superPullId, reason });
    if (!result.ok) setError(result.message);
  }
  return (
    <div className="flex min-w-48 flex-col gap-1">
      <label className="field" htmlFor={`remove-${superPullId}`}><span>Why take {tag} out?</span>
        <input id={`remove-${superPullId}`} className="input" value={reason} onChange={(e) => setReason(e.target.value)} /></label>
      {error ? <small className="field-error" role="alert">{error}</small> : null}
      <div className="flex gap-1">
        <button type="button" className="btn-danger min-h-9 px-2 py-1" disabled={reason.trim().length < 5} onClick={confirm}>Take out</button>
        <button type="button" className="btn-quiet min-h-9 px-2 py-1" onClick={() => setOpen(false)}>Cancel</button>
      </div>
    </div>
  );
}
