'use client';
import { useState } from 'react';
import type { ActionResult } from '@/lib/schemas/result';
import type { VoidInput } from '@/lib/schemas/lots';

/** Corrects a record by voiding it with a written reason; nothing is deleted. */
export function VoidButton({ lotId, kind, recordId, what, onVoid }: { lotId: number; kind: VoidInput['kind']; recordId: number; what: string; onVoid: (v: VoidInput) => Promise<ActionResult> }) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string>();
  if (!open) return <button type="button" className="btn-quiet min-h-0 px-2 py-1" onClick={() => setOpen(true)}>Void<span className="sr-only"> {what}</span></button>;
  async function confirm() {
    const result = await onVoid({ lotId, kind, recordId, reason });
    if (result.ok) setOpen(false); else setError(result.message);
  }
  return (
    <div className="flex min-w-48 flex-col gap-1">
      <label className="field" htmlFor={`void-${kind}-${recordId}`}><span>Why void {what}?</span>
        <input id={`void-${kind}-${recordId}`} className="input" value={reason} onChange={(e) => setReason(e.target.value)} /></label>
      {error ? <small className="field-error" role="alert">{error}</small> : null}
      <div className="flex gap-1">
        <button type="button" className="btn-danger min-h-9 px-2 py-1" disabled={reason.trim().length < 5} onClick={confirm}>Void</button>
        <button type="button" className="btn-quiet min-h-9 px-2 py-1" onClick={() => setOpen(false)}>Cancel</button>
      </div>
    </div>
  );
}
