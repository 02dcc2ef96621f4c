'use client';
import { useRef, useState } from 'react';
import { ScanLine } from 'lucide-react';
import type { ActionResult } from '@/lib/schemas/result';
import { scanSuperInput, type ScanSuperInput } from '@/lib/schemas/lots';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';
import { CameraScan } from './camera-scan';

type Added = { superPullId: number; tagCode: string | null; colonyCode: string; overridden: boolean };

/**
 * A barcode scanner acting as a keyboard types the tag code and Enter: the input keeps the
 * focus, sends on Enter, clears itself and lists what went in. Typing a code works the same.
 */
export function SuperScanner({
  lotId,
  isOwner,
  onScan,
}: {
  lotId: number;
  isOwner: boolean;
  onScan: (v: ScanSuperInput) => Promise<ActionResult<Added>>;
}) {
  const input = useRef<HTMLInputElement>(null);
  const [code, setCode] = useState('');
  const [added, setAdded] = useState<Added[]>([]);
  const [flagged, setFlagged] = useState<string | null>(null);
  const [reason, setReason] = useState('');
  // The inputs stay plain (the code clears the moment it is sent); each scan goes through `run`.
  const { run, pending, message } = useActionForm({
    schema: scanSuperInput,
    action: onScan,
    onSuccess: (one) => {
      setAdded((list) => [one, ...list]);
      setFlagged(null);
      setReason('');
    },
  });

  // Scans queue up: a scanner can fire the next code before the last one is saved.
  const chain = useRef<Promise<void>>(Promise.resolve());
  function send(tagCode: string, overrideReason?: string) {
    if (!tagCode.trim()) return;
    setCode('');
    input.current?.focus();
    chain.current = chain.current.then(async () => {
      const result = await run({ lotId, tagCode, overrideReason });
      if (result && !result.ok) setFlagged(isOwner && /flagged/.test(result.message ?? '') ? tagCode : null);
    });
  }

  return (
    <div className="space-y-3">
      <form
        onSubmit={(e) => {
          e.preventDefault();
          send(code);
        }}
        className="flex flex-wrap items-end gap-2"
      >
        <label className="field min-w-0 flex-1" htmlFor="scan-tag">
          <span>Scan or type a super tag</span>
          <input
            id="scan-tag"
            ref={input}
            autoFocus
            autoComplete="off"
            autoCapitalize="characters"
            spellCheck={false}
            enterKeyHint="go"
            className="input font-mono"
            value={code}
            onChange={(e) => setCode(e.target.value)}
            aria-describedby="scan-hint"
          />
          <small id="scan-hint" className="hint">
            A handheld scanner types the code and Enter; each super goes straight in.
          </small>
        </label>
        <button type="submit" className="btn-secondary">
          <ScanLine aria-hidden className="h-4 w-4" /> Add super
        </button>
      </form>
      <CameraScan onCode={(c) => send(c)} />
      <FormMessage error={message.error} />
      {flagged ? (
        <form
          onSubmit={(e) => {
            e.preventDefault();
            send(flagged, reason);
          }}
          className="space-y-2 card border-bad-fg"
        >
          <label className="field" htmlFor="override-reason">
            <span>Owner override for {flagged}: why may this flagged super go in?</span>
            <textarea
              id="override-reason"
              rows={2}
              className="input"
              value={reason}
              onChange={(e) => setReason(e.target.value)}
            />
          </label>
          <button type="submit" className="btn-danger" disabled={pending || reason.trim().length < 5}>
            Override and add {flagged}
          </button>
        </form>
      ) : null}
      {added.length ? (
        <ul aria-label="Added by scanning" className="space-y-1 text-sm">
          {added.map((a) => (
            <li key={a.superPullId}>
              ✓ <span className="font-mono">{a.tagCode}</span> from colony {a.colonyCode}
              {a.overridden ? ' (owner override)' : ''}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
