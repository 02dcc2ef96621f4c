'use client';
import { useState } from 'react';
import type { ActionResult } from '@/lib/schemas/result';
import type { PickSupersInput } from '@/lib/schemas/lots';
import { Chip } from '@/components/ui/chip';
import { FormMessage } from '@/components/ui/form-message';

export type PickableSuper = { id: number; tagCode: string | null; colonyCode: string; yardName: string; pulledOn: string; depth: string; full: string; flagged: boolean; flagReasons: string[] };

/** Pulled supers in no lot yet: tick and add. Flagged ones go in by scanning with an owner override. */
export function SuperPicker({ lotId, supers, onPick }: { lotId: number; supers: PickableSuper[]; onPick: (v: PickSupersInput) => Promise<ActionResult<unknown>> }) {
  const [picked, setPicked] = useState<number[]>([]);
  const [msg, setMsg] = useState<{ error?: string; success?: string }>({});
  const [busy, setBusy] = useState(false);
  const toggle = (id: number) => setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : [...p, id]));
  async function add() {
    setBusy(true);
    const result = await onPick({ lotId, superPullIds: picked });
    setBusy(false);
    if (result.ok) { setMsg({ success: `${picked.length} super${picked.length === 1 ? '' : 's'} added.` }); setPicked([]); }
    else setMsg({ error: result.message });
  }
  if (!supers.length) return <p className="hint">No pulled supers waiting for a lot match these filters.</p>;
  return (
    <div className="space-y-3">
      <div className="max-h-96 overflow-auto">
        <table className="data-table">
          <caption className="sr-only">Pulled supers not yet in a lot</caption>
          <thead><tr><th scope="col"><span className="sr-only">Pick</span></th><th scope="col">Tag</th><th scope="col">Colony</th><th scope="col">Yard</th><th scope="col">Pulled</th><th scope="col" className="num">Full</th><th scope="col">Status</th></tr></thead>
          <tbody>
            {supers.map((s) => (
              <tr key={s.id}>
                <td><input type="checkbox" className="h-5 w-5" aria-label={`Pick super ${s.tagCode ?? s.id}`} checked={picked.includes(s.id)} disabled={s.flagged} onChange={() => toggle(s.id)} /></td>
                <td className="font-mono">{s.tagCode ?? '—'}</td><td>{s.colonyCode}</td><td>{s.yardName}</td><td>{s.pulledOn}</td><td className="num">{s.full}</td>
                <td>{s.flagged ? <Chip tone="bad" title={s.flagReasons.join('; ')}>flagged</Chip> : <Chip tone="ok">ready</Chip>}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <FormMessage error={msg.error} success={msg.success} />
      <button type="button" className="btn-secondary" disabled={busy || picked.length === 0} onClick={add}>Add {picked.length || ''} ticked super{picked.length === 1 ? '' : 's'}</button>
    </div>
  );
}
