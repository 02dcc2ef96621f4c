'use client';
import { useState } from 'react';
import type { ActionResult } from '@/lib/schemas/result';
import type { StageInput } from '@/lib/schemas/lots';
import type { LotStage } from '@/lib/domain/lot-stage';
import { FormMessage } from '@/components/ui/form-message';

type Props = {
  lotId: number; stage: LotStage; isOwner: boolean;
  onChange: (v: StageInput) => Promise<ActionResult<{ stage: LotStage; holdReasons: string[] }>>;
};

/** The stage buttons that make sense now; the server decides (lib/domain/lot-stage.ts) and explains a refusal. */
export function StageControls({ lotId, stage, isOwner, onChange }: Props) {
  const [reason, setReason] = useState('');
  const [busy, setBusy] = useState(false);
  const [msg, setMsg] = useState<{ error?: string; success?: string }>({});
  async function go(target: StageInput['target'], withReason = false) {
    setBusy(true);
    const result = await onChange({ lotId, target, reason: withReason ? reason : undefined });
    setBusy(false);
    if (!result.ok) return setMsg({ error: result.message });
    setReason('');
    setMsg(result.data.stage === 'held'
      ? { error: `The lot is held: ${result.data.holdReasons.join('; ')}` }
      : { success: `The lot is now ${result.data.stage.replace('_', ' ')}.` });
  }
  const needsReason = stage === 'held' ? isOwner : stage !== 'packed_out';
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2">
        {stage === 'gathering' ? <button type="button" className="btn-primary" disabled={busy} onClick={() => go('extracted')}>Mark extracted</button> : null}
        {stage === 'extracted' ? <button type="button" className="btn-primary" disabled={busy} onClick={() => go('released')}>Release the lot</button> : null}
      </div>
      {needsReason ? (
        <div className="space-y-2">
          <label className="field" htmlFor="stage-reason"><span>{stage === 'held' ? 'Owner’s reason to take the lot out of held' : 'Reason to hold the lot'}</span>
            <textarea id="stage-reason" rows={2} className="input" value={reason} onChange={(e) => setReason(e.target.value)} /></label>
          <div className="flex flex-wrap gap-2">
            {stage === 'held' ? (
              <>
                <button type="button" className="btn-danger" disabled={busy || reason.trim().length < 5} onClick={() => go('released', true)}>Release held lot</button>
                <button type="button" className="btn-secondary" disabled={busy || reason.trim().length < 5} onClick={() => go('extracted', true)}>Back to extracted</button>
              </>
            ) : <button type="button" className="btn-danger" disabled={busy || reason.trim().length < 5} onClick={() => go('held', true)}>Hold the lot</button>}
          </div>
        </div>
      ) : stage === 'held' ? <p className="hint">Only the owner can take a lot out of held.</p> : null}
      <FormMessage error={msg.error} success={msg.success} />
    </div>
  );
}
