'use client';
import { useState } from 'react';
import type { ActionResult } from '@/lib/schemas/result';
import { Chip } from '@/components/ui/chip';

type Recipient = { id: number; name: string };
type Props = {
  season: number;
  onList: (input: { season: number }) => Promise<ActionResult<Recipient[]>>;
  onSend: (input: { season: number; keeperId: number }) => Promise<ActionResult<{ queued: boolean; name: string }>>;
};
type Line = { name: string; state: 'queued' | 'already sent' | 'failed'; message?: string };

/** Sends each keeper their season report, one request per keeper, showing n of N as it goes. */
export function SendReports({ season, onList, onSend }: Props) {
  const [running, setRunning] = useState(false);
  const [total, setTotal] = useState<number | null>(null);
  const [lines, setLines] = useState<Line[]>([]);
  const [error, setError] = useState<string | null>(null);

  async function run() {
    setRunning(true);
    setError(null);
    setLines([]);
    try {
      const list = await onList({ season });
      if (!list.ok) return setError(list.message ?? 'Could not list the keepers.');
      setTotal(list.data.length);
      for (const k of list.data) {
        const r = await onSend({ season, keeperId: k.id });
        const line: Line = r.ok ? { name: k.name, state: r.data.queued ? 'queued' : 'already sent' } : { name: k.name, state: 'failed', message: r.message };
        setLines((prev) => [...prev, line]);
      }
    } catch {
      setError('The connection failed. Sending again is safe: reports already queued are not sent twice.');
    } finally {
      setRunning(false);
    }
  }

  const done = lines.length;
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" className="btn-primary min-h-11" onClick={run} disabled={running}>
          {running ? 'Sending…' : `Send ${season} season reports`}
        </button>
        {total !== null ? (
          <span role="status" aria-live="polite" className="font-medium">
            {running ? `Sending ${done} of ${total}` : `Done: ${done} of ${total}`}
          </span>
        ) : null}
      </div>
      {total !== null ? <progress className="w-full max-w-md" max={Math.max(total, 1)} value={done} aria-label="Reports sent" /> : null}
      {total === 0 ? <p className="hint">No keeper has colonies in this season, so there is nothing to send.</p> : null}
      {error ? <p className="field-error" role="alert">{error}</p> : null}
      {lines.length > 0 ? (
        <ul className="text-sm">
          {lines.map((l) => (
            <li key={l.name}>{l.name}: <Chip tone={l.state === 'failed' ? 'bad' : l.state === 'queued' ? 'ok' : 'neutral'}>{l.state}</Chip>{l.message ? ` — ${l.message}` : ''}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
