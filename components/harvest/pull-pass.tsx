'use client';
import { useEffect, useState } from 'react';
import { Check, RotateCw, TriangleAlert } from 'lucide-react';
import { SUPER_DEPTHS, type PullEntry } from '@/lib/schemas/harvest';
import { newEntryKey } from './entry-key';

type Depth = (typeof SUPER_DEPTHS)[number];
type Result = { ok: true; key: string; id: number; flagged: boolean; flagReasons: string[] } | { ok: false; key: string; message: string };
type Save = (input: { entries: PullEntry[] }) => Promise<{ ok: true; data?: unknown } | { ok: false; message?: string }>;
type Sent = { key: string; state: 'sending' | 'saved' | 'failed'; flagged?: boolean; reasons?: string[]; message?: string; entry: PullEntry };
type Colony = { id: number; code: string; lastPulledOn: string | null };

const DEPTH_KEY = 'combtrace.pull.depth';
const FRAMES_KEY = 'combtrace.pull.frames';

/** Sends one entry; a network failure is retried with the SAME key, so the server records it once. */
async function sendWithRetry(onSave: Save, entry: PullEntry, tries = 3): Promise<Result> {
  let last = 'Could not reach the server.';
  for (let i = 0; i < tries; i++) {
    try {
      const r = await onSave({ entries: [entry] });
      if (!r.ok) return { ok: false, key: entry.idempotencyKey, message: r.message ?? 'Not saved.' };
      return (r.data as { results: Result[] }).results[0];
    } catch {
      last = 'No connection: not saved yet.';
      await new Promise((res) => setTimeout(res, 800 * (i + 1)));
    }
  }
  return { ok: false, key: entry.idempotencyKey, message: last };
}

function Details({ colony, value, onChange }: { colony: Colony; value: Partial<PullEntry>; onChange: (v: Partial<PullEntry>) => void }) {
  const id = (s: string) => `${s}-${colony.id}`;
  return (
    <div className="mt-3 grid grid-cols-2 gap-3">
      <label className="field" htmlFor={id('w')}><span>Full weight</span>
        <input id={id('w')} className="input min-h-11" inputMode="decimal" value={String(value.weight ?? '')} onChange={(e) => onChange({ weight: e.target.value })} />
      </label>
      <label className="field" htmlFor={id('u')}><span>Unit</span>
        <select id={id('u')} className="input min-h-11" value={value.weightUnit ?? 'kg'} onChange={(e) => onChange({ weightUnit: e.target.value as 'kg' | 'lb' })}>
          <option value="kg">kg</option><option value="lb">lb</option>
        </select>
      </label>
      <label className="field" htmlFor={id('c')}><span>Capped frames (if not weighed)</span>
        <input id={id('c')} className="input min-h-11" inputMode="decimal" value={String(value.cappedFrames ?? '')} onChange={(e) => onChange({ cappedFrames: e.target.value })} />
      </label>
      <label className="field" htmlFor={id('t')}><span>Tag code</span>
        <input id={id('t')} className="input min-h-11" autoCapitalize="characters" value={String(value.tagCode ?? '')} onChange={(e) => onChange({ tagCode: e.target.value })} />
      </label>
    </div>
  );
}

/**
 * The keeper's pass through a yard: pick the pull date, box depth and frames once (remembered
 * on this device), then one tap per colony. Each tap is one super with its own idempotency key.
 */
export function PullPass({ colonies, today, defaultUnit, onSave }: { colonies: Colony[]; today: string; defaultUnit: 'kg' | 'lb'; onSave: Save }) {
  const [pulledOn, setPulledOn] = useState(today);
  const [depth, setDepth] = useState<Depth>('medium');
  const [frames, setFrames] = useState('10');
  const [details, setDetails] = useState<Record<number, Partial<PullEntry> | undefined>>({});
  const [sent, setSent] = useState<Record<number, Sent[]>>({});

  useEffect(() => {
    const d = localStorage.getItem(DEPTH_KEY);
    if (d && (SUPER_DEPTHS as readonly string[]).includes(d)) setDepth(d as Depth);
    const f = localStorage.getItem(FRAMES_KEY);
    if (f && /^\d{1,2}$/.test(f)) setFrames(f);
  }, []);
  const chooseDepth = (d: Depth) => { setDepth(d); localStorage.setItem(DEPTH_KEY, d); };
  const chooseFrames = (f: string) => { setFrames(f); if (/^\d{1,2}$/.test(f)) localStorage.setItem(FRAMES_KEY, f); };

  function update(colonyId: number, key: string, patch: Partial<Sent>) {
    setSent((s) => ({ ...s, [colonyId]: (s[colonyId] ?? []).map((x) => (x.key === key ? { ...x, ...patch } : x)) }));
  }

  async function send(colonyId: number, entry: PullEntry) {
    update(colonyId, entry.idempotencyKey, { state: 'sending', message: undefined });
    const r = await sendWithRetry(onSave, entry);
    if (r.ok) update(colonyId, entry.idempotencyKey, { state: 'saved', flagged: r.flagged, reasons: r.flagReasons });
    else update(colonyId, entry.idempotencyKey, { state: 'failed', message: r.message });
  }

  function pull(colony: Colony) {
    const extra = details[colony.id] ?? {};
    const entry: PullEntry = {
      colonyId: colony.id, pulledOn, depth, frameCount: Number(frames), idempotencyKey: newEntryKey(),
      weight: extra.weight === '' ? null : extra.weight ?? null, weightUnit: extra.weightUnit ?? defaultUnit,
      cappedFrames: extra.cappedFrames === '' ? null : extra.cappedFrames ?? null, tagCode: extra.tagCode || null,
    };
    setSent((s) => ({ ...s, [colony.id]: [...(s[colony.id] ?? []), { key: entry.idempotencyKey, state: 'sending', entry }] }));
    setDetails((d) => ({ ...d, [colony.id]: undefined }));
    void send(colony.id, entry);
  }

  const total = Object.values(sent).flat().filter((x) => x.state === 'saved').length;
  return (
    <div className="space-y-4">
      <fieldset className="card grid gap-3">
        <legend className="sr-only">For every super in this pass</legend>
        <label className="field" htmlFor="pull-date"><span>Pulled on</span>
          <input id="pull-date" type="date" className="input min-h-11" value={pulledOn} max={today} onChange={(e) => setPulledOn(e.target.value)} />
        </label>
        <div role="radiogroup" aria-label="Box depth" className="grid grid-cols-3 gap-2">
          {SUPER_DEPTHS.map((d) => (
            <button key={d} type="button" role="radio" aria-checked={depth === d} onClick={() => chooseDepth(d)}
              className={`min-h-12 rounded-lg border px-2 font-semibold capitalize ${depth === d ? 'border-forest-800 bg-forest-800 text-paper' : 'border-line bg-paper-raised text-ink'}`}>{d}</button>
          ))}
        </div>
        <label className="field" htmlFor="pull-frames"><span>Frames per super</span>
          <input id="pull-frames" className="input min-h-11" inputMode="numeric" value={frames} onChange={(e) => chooseFrames(e.target.value)} />
        </label>
      </fieldset>
      <p role="status" className="text-sm text-ink-soft">{total === 0 ? 'Tap a colony once for each super you take off it.' : `${total} ${total === 1 ? 'super' : 'supers'} recorded in this pass.`}</p>
      <ul className="space-y-3">
        {colonies.map((c) => {
          const mine = sent[c.id] ?? [];
          const open = details[c.id] !== undefined;
          const busy = mine.some((x) => x.state === 'sending');
          return (
            <li key={c.id} className="card" aria-label={`Colony ${c.code}`}>
              <div className="flex items-center justify-between gap-2">
                <div>
                  <div className="font-heading text-xl font-bold">{c.code}</div>
                  <div className="hint">{c.lastPulledOn ? `last pull ${c.lastPulledOn}` : 'no pull yet'}</div>
                </div>
                <button type="button" className="btn-quiet min-h-11" aria-expanded={open} onClick={() => setDetails((d) => ({ ...d, [c.id]: open ? undefined : {} }))}>
                  {open ? 'No details' : 'Weight, tag…'}
                </button>
              </div>
              {open ? <Details colony={c} value={details[c.id] ?? {}} onChange={(v) => setDetails((d) => ({ ...d, [c.id]: { ...(d[c.id] ?? {}), ...v } }))} /> : null}
              <button type="button" disabled={busy} onClick={() => pull(c)} className="btn-primary mt-3 min-h-14 w-full text-lg">
                {busy ? 'Saving…' : mine.length ? `Pulled another super from ${c.code}` : `Pulled a super from ${c.code}`}
              </button>
              <ul className="mt-2 space-y-1 text-sm">
                {mine.map((x, i) => (
                  <li key={x.key} className="flex flex-wrap items-start gap-2">
                    {x.state === 'saved' ? <Check aria-hidden className="h-4 w-4 text-ok-fg" /> : x.state === 'failed' ? <TriangleAlert aria-hidden className="h-4 w-4 text-bad-fg" /> : <RotateCw aria-hidden className="h-4 w-4 animate-spin" />}
                    <span>Super {i + 1}: {x.state === 'saved' ? 'recorded' : x.state === 'failed' ? x.message : 'saving…'}</span>
                    {x.state === 'saved' && x.flagged ? <span className="w-full rounded bg-bad-bg px-2 py-1 text-bad-fg"><strong>Flagged:</strong> {x.reasons?.join('; ')}</span> : null}
                    {x.state === 'failed' ? <button type="button" className="btn-secondary min-h-11" onClick={() => void send(c.id, x.entry)}>Try again</button> : null}
                  </li>
                ))}
              </ul>
            </li>
          );
        })}
      </ul>
    </div>
  );
}
