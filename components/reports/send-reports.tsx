'use client';
import { useState } from 'react';
import type { ActionResult } from '@/lib/schemas/result';
import { sendSeasonInput } from '@/lib/schemas/reports';
import { Chip } from '@/components/ui/chip';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

type Recipient = { id: number; name: string };
type Props = {
  season: number;
  onList: (input: { season: number }) => Promise<ActionResult<Recipient[]>>;
  onSend: (input: { season: number; keeperId: number }) => Promise<ActionResult<{ queued: boolean; name: string }>>;
};
type Line = { name: string; state: 'queued' | 'already sent' | 'failed'; message?: string };

/** Sends each keeper their season report, one request per keeper, showing n of N as it goes. */
export function SendReports({ season, onList, onSend }: Props) {
  const [total, setTotal] = useState<number | null>(null);
  const [lines, setLines] = useState<Line[]>([]);

  // One run lists the keepers, then sends to each in turn; a keeper's refusal is a line, not the whole run's.
  async function sendAll(input: { season: number }): Promise<ActionResult> {
    setLines([]);
    try {
      const list = await onList(input);
      if (!list.ok) return { ok: false, message: list.message ?? 'Could not list the keepers.' };
      setTotal(list.data.length);
      for (const k of list.data) {
        const r = await onSend({ ...input, keeperId: k.id });
        const line: Line = r.ok
          ? { name: k.name, state: r.data.queued ? 'queued' : 'already sent' }
          : { name: k.name, state: 'failed', message: r.message };
        setLines((prev) => [...prev, line]);
      }
      return { ok: true };
    } catch {
      return {
        ok: false,
        message: 'The connection failed. Sending again is safe: reports already queued are not sent twice.',
      };
    }
  }
  const { run, pending: running, message } = useActionForm({ schema: sendSeasonInput, action: sendAll });

  const done = lines.length;
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" className="btn-primary min-h-11" onClick={() => void run({ season })} disabled={running}>
          {running ? 'Sending…' : `Send ${season} season reports`}
        </button>
        {total !== null ? (
          <span role="status" aria-live="polite" className="font-medium">
            {running ? `Sending ${done} of ${total}` : `Done: ${done} of ${total}`}
          </span>
        ) : null}
      </div>
      {total !== null ? (
        <progress className="w-full max-w-md" max={Math.max(total, 1)} value={done} aria-label="Reports sent" />
      ) : null}
      {total === 0 ? <p className="hint">No keeper has colonies in this season, so there is nothing to send.</p> : null}
      <FormMessage {...message} />
      {lines.length > 0 ? (
        <ul className="text-sm">
          {lines.map((l) => (
            <li key={l.name}>
              {l.name}:{' '}
              <Chip tone={l.state === 'failed' ? 'bad' : l.state === 'queued' ? 'ok' : 'neutral'}>{l.state}</Chip>
              {l.message ? ` — ${l.message}` : ''}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
