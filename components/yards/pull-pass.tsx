'use client';
import { CameraScan } from '@/components/lots/camera-scan';
import { useCallback, useEffect, useRef, useState } from 'react';
import { Check, CloudOff, RotateCw, TriangleAlert } from 'lucide-react';
import { SUPER_DEPTHS, type PullEntry } from '@/lib/schemas/supers';
import { newEntryKey } from '@/components/ui/entry-key';
import {
  ANSWER_WITHIN_MS,
  NoAnswer,
  answerWithin,
  changeWaiting,
  markRefused,
  notShown,
  pullOutcome,
  readWaiting,
  toSend,
  waitingKey,
  withoutWaiting,
  withWaiting,
  type PullOutcome,
  type PullReply,
  type StoredEntry,
  type WaitingPull,
} from './pull-queue';

type Depth = (typeof SUPER_DEPTHS)[number];
type Save = (input: { entries: PullEntry[] }) => Promise<PullReply>;
/**
 * One tap as the page shows it. `waited`: it has been kept on this phone for a later send
 * (it failed, was tapped with no signal, or was restored after a reload).
 */
type Shown = {
  key: string;
  entry: StoredEntry;
  colonyCode: string;
  yardName: string;
  state: 'sending' | 'waiting' | 'saved' | 'refused';
  waited: boolean;
  flagged?: boolean;
  reasons?: string[];
  message?: string;
};
/** `tags`: the tags on this hive now, offered as a pick list for the pull. */
type Colony = { id: number; code: string; lastPulledOn: string | null; tags?: string[] };

const DEPTH_KEY = 'combtrace.pull.depth';
const FRAMES_KEY = 'combtrace.pull.frames';
const KEPT = 'waiting to send — saved on this phone';
const supers = (n: number) => `${n} ${n === 1 ? 'super' : 'supers'}`;

/**
 * Sends one entry; a network failure is retried with the SAME key, so the server records it once.
 * With no signal it does not try at all: the entry stays on the phone and the `online` event sends it.
 */
async function sendWithRetry(onSave: Save, entry: PullEntry, tries = 3): Promise<PullOutcome> {
  for (let i = 0; i < tries; i++) {
    if (!navigator.onLine) break;
    try {
      return pullOutcome(entry.idempotencyKey, await answerWithin(onSave({ entries: [entry] }), ANSWER_WITHIN_MS));
    } catch (err) {
      // A weak signal can leave a request hanging; later sends would queue behind it, so stop here.
      // The entry stays on the phone; if the hung request does arrive, the resend is recognised by its key.
      if (err instanceof NoAnswer) break;
      if (i < tries - 1) await new Promise((res) => setTimeout(res, 800 * (i + 1)));
    }
  }
  return pullOutcome(entry.idempotencyKey, undefined);
}

const fromStored = (w: WaitingPull): Shown => ({
  key: w.entry.idempotencyKey,
  entry: w.entry,
  colonyCode: w.colonyCode,
  yardName: w.yardName,
  state: w.refused === undefined ? 'waiting' : 'refused',
  waited: true,
  message: w.refused,
});

function EntryLine({
  item,
  label,
  name,
  onDismiss,
}: {
  item: Shown;
  label: string;
  name: string;
  onDismiss: () => void;
}) {
  const sendingKept = item.state === 'sending' && item.waited;
  const text =
    item.state === 'saved'
      ? 'recorded'
      : item.state === 'refused'
        ? `not recorded — ${item.message ?? 'refused'}`
        : item.state === 'waiting'
          ? item.message
            ? `${KEPT} (${item.message})`
            : KEPT
          : sendingKept
            ? `${KEPT}; sending…`
            : 'saving…';
  return (
    <li className="flex flex-wrap items-start gap-2">
      {item.state === 'saved' ? (
        <Check aria-hidden className="mt-0.5 h-4 w-4 shrink-0 text-ok-fg" />
      ) : item.state === 'refused' ? (
        <TriangleAlert aria-hidden className="mt-0.5 h-4 w-4 shrink-0 text-bad-fg" />
      ) : item.state === 'waiting' ? (
        <CloudOff aria-hidden className="mt-0.5 h-4 w-4 shrink-0 text-warn-fg" />
      ) : (
        <RotateCw aria-hidden className="mt-0.5 h-4 w-4 shrink-0 animate-spin" />
      )}
      <span
        className={`min-w-0 flex-1 ${item.state === 'refused' ? 'text-bad-fg' : item.state === 'waiting' || sendingKept ? 'text-warn-fg' : ''}`}
      >
        {label}: {text}
      </span>
      {item.state === 'saved' && item.flagged ? (
        <span className="w-full rounded bg-bad-bg px-2 py-1 text-bad-fg">
          <strong>Flagged:</strong> {item.reasons?.join('; ')}
        </span>
      ) : null}
      {item.state === 'refused' ? (
        <button type="button" className="btn-secondary min-h-11" aria-label={`Dismiss ${name}`} onClick={onDismiss}>
          Dismiss
        </button>
      ) : null}
    </li>
  );
}

function Details({
  colony,
  value,
  onChange,
}: {
  colony: Colony;
  value: Partial<PullEntry>;
  onChange: (v: Partial<PullEntry>) => void;
}) {
  const id = (s: string) => `${s}-${colony.id}`;
  return (
    <div className="mt-3 grid grid-cols-2 gap-3">
      <label className="field" htmlFor={id('w')}>
        <span>Full weight</span>
        <input
          id={id('w')}
          className="input min-h-11"
          inputMode="decimal"
          value={String(value.weight ?? '')}
          onChange={(e) => onChange({ weight: e.target.value })}
        />
      </label>
      <label className="field" htmlFor={id('u')}>
        <span>Unit</span>
        <select
          id={id('u')}
          className="input min-h-11"
          value={value.weightUnit ?? 'kg'}
          onChange={(e) => onChange({ weightUnit: e.target.value as 'kg' | 'lb' })}
        >
          <option value="kg">kg</option>
          <option value="lb">lb</option>
        </select>
      </label>
      <label className="field" htmlFor={id('c')}>
        <span>Capped frames (if not weighed)</span>
        <input
          id={id('c')}
          className="input min-h-11"
          inputMode="decimal"
          value={String(value.cappedFrames ?? '')}
          onChange={(e) => onChange({ cappedFrames: e.target.value })}
        />
      </label>
      <label className="field" htmlFor={id('t')}>
        <span>Tag code</span>
        <input
          id={id('t')}
          className="input min-h-11 font-mono uppercase"
          autoCapitalize="characters"
          autoComplete="off"
          list={id('tags')}
          value={String(value.tagCode ?? '')}
          onChange={(e) => onChange({ tagCode: e.target.value.toUpperCase() })}
        />
        <datalist id={id('tags')}>
          {(colony.tags ?? []).map((t) => (
            <option key={t} value={t} />
          ))}
        </datalist>
      </label>
      <CameraScan onCode={(code) => onChange({ tagCode: code.trim().toUpperCase() })} />
    </div>
  );
}

/**
 * The keeper's pass through a yard: pick the pull date, box depth and frames once (remembered
 * on this device), then one tap per colony. Each tap is one super with its own idempotency key.
 * Every tap is kept in this browser until the server answers (components/yards/pull-queue.ts):
 * with no signal, after a reload or a flat battery, it is shown again and sent when there is a
 * connection; the key makes a second send harmless.
 */
export function PullPass({
  colonies,
  today,
  defaultUnit,
  onSave,
  userId,
  yardName,
}: {
  colonies: Colony[];
  today: string;
  defaultUnit: 'kg' | 'lb';
  onSave: Save;
  userId: number;
  yardName: string;
}) {
  const [pulledOn, setPulledOn] = useState(today);
  const [depth, setDepth] = useState<Depth>('medium');
  const [frames, setFrames] = useState('10');
  const [details, setDetails] = useState<Record<number, Partial<PullEntry> | undefined>>({});
  const [shown, setShown] = useState<Shown[]>([]);
  const [ready, setReady] = useState(false);
  const [online, setOnline] = useState(true);
  const [draining, setDraining] = useState(false);
  const [storageFailed, setStorageFailed] = useState(false);
  const inFlight = useRef(new Set<string>());
  const drainingRef = useRef(false);
  const saveRef = useRef(onSave);
  useEffect(() => {
    saveRef.current = onSave;
  }, [onSave]);
  const storeKey = waitingKey(userId);

  const patch = (key: string, p: Partial<Shown>) => setShown((s) => s.map((x) => (x.key === key ? { ...x, ...p } : x)));
  const keep = useCallback(
    (change: (list: WaitingPull[]) => WaitingPull[]) => {
      if (!changeWaiting(localStorage, storeKey, change)) setStorageFailed(true);
    },
    [storeKey],
  );

  const send = useCallback(
    async (entry: PullEntry): Promise<PullOutcome['kind'] | 'busy'> => {
      const key = entry.idempotencyKey;
      if (inFlight.current.has(key)) return 'busy';
      inFlight.current.add(key);
      patch(key, { state: 'sending' });
      const out = await sendWithRetry(saveRef.current, entry);
      inFlight.current.delete(key);
      if (out.kind === 'saved') {
        keep((l) => withoutWaiting(l, [key]));
        patch(key, { state: 'saved', flagged: out.flagged, reasons: out.flagReasons, message: undefined });
      } else if (out.kind === 'refused') {
        keep((l) => markRefused(l, key, out.message));
        patch(key, { state: 'refused', message: out.message });
      } else {
        patch(key, { state: 'waiting', waited: true, message: out.message });
      }
      return out.kind;
    },
    [keep],
  );

  /** Reads what this user has waiting on this phone and shows the entries the page does not show yet. */
  const restore = useCallback((): WaitingPull[] => {
    const stored = readWaiting(localStorage, storeKey);
    setShown((s) => [...s, ...notShown(stored, new Set(s.map((x) => x.key))).map(fromStored)]);
    return stored;
  }, [storeKey]);

  /** Sends everything this user has waiting on this phone, one at a time; stops at the first entry that gets no answer. */
  const sendWaiting = useCallback(async () => {
    if (drainingRef.current) return;
    drainingRef.current = true;
    setDraining(true);
    try {
      const stored = restore();
      for (const w of toSend(stored, inFlight.current)) {
        if ((await send(w.entry)) === 'waiting') break;
      }
    } finally {
      drainingRef.current = false;
      setDraining(false);
    }
  }, [send, restore]);

  useEffect(() => {
    const d = localStorage.getItem(DEPTH_KEY);
    // eslint-disable-next-line react-hooks/set-state-in-effect -- this phone's saved choice, read after hydration
    if (d && (SUPER_DEPTHS as readonly string[]).includes(d)) setDepth(d as Depth);
    const f = localStorage.getItem(FRAMES_KEY);
    if (f && /^\d{1,2}$/.test(f)) setFrames(f);
  }, []);

  // Restore what is waiting on this phone, send it if there is a connection, and again whenever the connection comes back.
  useEffect(() => {
    // eslint-disable-next-line react-hooks/set-state-in-effect -- the queue saved on this phone, read after hydration
    const stored = restore();
    setOnline(navigator.onLine);
    setReady(true);
    if (navigator.onLine && toSend(stored).length) void sendWaiting();
    const up = () => {
      setOnline(true);
      void sendWaiting();
    };
    const down = () => setOnline(false);
    window.addEventListener('online', up);
    window.addEventListener('offline', down);
    return () => {
      window.removeEventListener('online', up);
      window.removeEventListener('offline', down);
    };
  }, [restore, sendWaiting]);

  const chooseDepth = (d: Depth) => {
    setDepth(d);
    localStorage.setItem(DEPTH_KEY, d);
  };
  const chooseFrames = (f: string) => {
    setFrames(f);
    if (/^\d{1,2}$/.test(f)) localStorage.setItem(FRAMES_KEY, f);
  };

  function pull(colony: Colony) {
    const extra = details[colony.id] ?? {};
    const entry: StoredEntry = {
      colonyId: colony.id,
      pulledOn,
      depth,
      frameCount: Number(frames),
      idempotencyKey: newEntryKey(),
      weight: extra.weight === '' ? null : (extra.weight ?? null),
      weightUnit: extra.weightUnit ?? defaultUnit,
      cappedFrames: extra.cappedFrames === '' ? null : (extra.cappedFrames ?? null),
      tagCode: extra.tagCode || null,
    };
    // Kept on the phone before anything is sent: a closed tab or a flat battery mid-send loses nothing.
    keep((l) => withWaiting(l, { entry, colonyCode: colony.code, yardName, savedAt: new Date().toISOString() }));
    const offline = !navigator.onLine;
    setShown((s) => [
      ...s,
      {
        key: entry.idempotencyKey,
        entry,
        colonyCode: colony.code,
        yardName,
        state: offline ? 'waiting' : 'sending',
        waited: offline,
      },
    ]);
    setDetails((d) => ({ ...d, [colony.id]: undefined }));
    if (!offline) void send(entry);
  }

  function dismiss(item: Shown) {
    keep((l) => withoutWaiting(l, [item.key]));
    setShown((s) => s.filter((x) => x.key !== item.key));
    // The Dismiss button goes away: keep keyboard focus in the pass.
    (document.getElementById(`pull-${item.entry.colonyId}`) ?? document.getElementById('pull-summary'))?.focus();
  }

  const total = shown.filter((x) => x.state === 'saved').length;
  const waiting = shown.filter((x) => x.state === 'waiting' || (x.state === 'sending' && x.waited)).length;
  const refused = shown.filter((x) => x.state === 'refused').length;
  const here = new Set(colonies.map((c) => c.id));
  const elsewhere = shown.filter((x) => !here.has(x.entry.colonyId));
  const summary = [
    waiting ? `${supers(waiting)} waiting to send — saved on this phone.` : '',
    waiting && !online ? 'No signal: they go as soon as there is one.' : '',
    refused ? `${supers(refused)} not recorded: see the marked entries.` : '',
    storageFailed ? 'This browser would not keep unsent supers: keep this page open until they are sent.' : '',
  ]
    .filter(Boolean)
    .join(' ');
  const attention = summary !== '';
  return (
    <div className="space-y-4">
      <fieldset className="grid gap-3 card">
        <legend className="sr-only">For every super in this pass</legend>
        <label className="field" htmlFor="pull-date">
          <span>Pulled on</span>
          <input
            id="pull-date"
            type="date"
            className="input min-h-11"
            value={pulledOn}
            max={today}
            onChange={(e) => setPulledOn(e.target.value)}
          />
        </label>
        <div role="radiogroup" aria-label="Box depth" className="grid grid-cols-3 gap-2">
          {SUPER_DEPTHS.map((d) => (
            <button
              key={d}
              type="button"
              role="radio"
              aria-checked={depth === d}
              onClick={() => chooseDepth(d)}
              className={`min-h-12 rounded-lg border px-2 font-semibold capitalize ${depth === d ? 'border-forest-800 bg-forest-800 text-paper' : 'border-line bg-paper-raised text-ink'}`}
            >
              {d}
            </button>
          ))}
        </div>
        <label className="field" htmlFor="pull-frames">
          <span>Frames per super</span>
          <input
            id="pull-frames"
            className="input min-h-11"
            inputMode="numeric"
            value={frames}
            onChange={(e) => chooseFrames(e.target.value)}
          />
        </label>
      </fieldset>
      {elsewhere.length ? (
        <section aria-labelledby="pull-elsewhere" className="card">
          <h2 id="pull-elsewhere" className="font-heading text-lg font-bold">
            Other colonies
          </h2>
          <p className="hint">Tapped on this phone in another pass, or for a colony no longer listed here.</p>
          <ul className="mt-2 space-y-1 text-sm">
            {elsewhere.map((x) => (
              <EntryLine
                key={x.key}
                item={x}
                label={`${x.colonyCode} (${x.yardName}), ${x.entry.pulledOn}`}
                name={`the super for ${x.colonyCode}`}
                onDismiss={() => dismiss(x)}
              />
            ))}
          </ul>
        </section>
      ) : null}
      <ul className="space-y-3">
        {colonies.map((c) => {
          const mine = shown.filter((x) => x.entry.colonyId === c.id);
          const open = details[c.id] !== undefined;
          // Only a first send blocks a second tap on the same colony; a super waiting on the phone never does.
          const busy = mine.some((x) => x.state === 'sending' && !x.waited);
          return (
            <li key={c.id} className="card" aria-label={`Colony ${c.code}`}>
              <div className="flex items-center justify-between gap-2">
                <div>
                  <div className="font-heading text-xl font-bold">{c.code}</div>
                  <div className="hint">{c.lastPulledOn ? `last pull ${c.lastPulledOn}` : 'no pull yet'}</div>
                </div>
                <button
                  type="button"
                  className="btn-quiet min-h-11"
                  aria-expanded={open}
                  onClick={() => setDetails((d) => ({ ...d, [c.id]: open ? undefined : {} }))}
                >
                  {open ? 'No details' : 'Weight, tag…'}
                </button>
              </div>
              {open ? (
                <Details
                  colony={c}
                  value={details[c.id] ?? {}}
                  onChange={(v) => setDetails((d) => ({ ...d, [c.id]: { ...(d[c.id] ?? {}), ...v } }))}
                />
              ) : null}
              {/* Disabled until the page has started: a tap before that would do nothing. */}
              <button
                id={`pull-${c.id}`}
                type="button"
                disabled={!ready || busy}
                onClick={() => pull(c)}
                className="mt-3 btn-primary min-h-14 w-full text-lg"
              >
                {busy
                  ? 'Saving…'
                  : mine.length
                    ? `Pulled another super from ${c.code}`
                    : `Pulled a super from ${c.code}`}
              </button>
              {mine.length ? (
                <ul className="mt-2 space-y-1 text-sm">
                  {mine.map((x, i) => (
                    <EntryLine
                      key={x.key}
                      item={x}
                      label={`Super ${i + 1}`}
                      name={`super ${i + 1} of ${c.code}`}
                      onDismiss={() => dismiss(x)}
                    />
                  ))}
                </ul>
              ) : null}
            </li>
          );
        })}
      </ul>
      {/*
        The pass's status bar: always there, at the foot of the pass and held at the bottom of the
        screen while the list scrolls. What is waiting on the phone shows here, so nothing appears
        above the colonies and moves them under the keeper's thumb; "Send now" keeps its place.
      */}
      <div
        id="pull-summary"
        tabIndex={-1}
        className={`sticky bottom-0 z-10 flex min-h-21 items-center gap-3 rounded-card border p-3 shadow-lg ${attention ? 'border-warn-fg bg-warn-bg text-warn-fg' : 'border-line bg-paper-raised text-ink-soft'}`}
      >
        <div className="min-w-0 flex-1 text-sm">
          <p role="status">
            {total === 0
              ? 'Tap a colony once for each super you take off it.'
              : `${total} ${total === 1 ? 'super' : 'supers'} recorded in this pass.`}
          </p>
          <p role="status" className={summary ? 'font-semibold' : 'sr-only'}>
            {summary}
          </p>
        </div>
        {/* Room for the count and two lines of news, and the button's place kept when there is nothing to send: the bar keeps its shape. */}
        <button
          type="button"
          className={`btn-secondary min-h-11 shrink-0 ${waiting ? '' : 'invisible'}`}
          disabled={!waiting || draining || !ready}
          onClick={() => void sendWaiting()}
        >
          {draining ? 'Sending…' : 'Send now'}
        </button>
      </div>
    </div>
  );
}
