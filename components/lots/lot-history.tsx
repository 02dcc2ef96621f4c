import type { AuditRow } from '@/lib/data/audit';

const ACTIONS: Record<string, string> = {
  'lot.create': 'Lot started',
  'lot.blend': 'Blend made',
  'lot.update': 'Details changed',
  'lot.wax': 'Cappings wax recorded',
  'lot.super.add': 'Super added',
  'lot.super.remove': 'Super taken out',
  'lot.super.override': 'Flagged super overridden',
  'lot.super.empty': 'Super empty weight',
  'lot.container.add': 'Container weighed',
  'lot.container.void': 'Container voided',
  'lot.reading.add': 'Moisture reading',
  'lot.reading.void': 'Reading voided',
  'lot.labfile.add': 'Lab report uploaded',
  'lot.labfile.void': 'Lab report voided',
  'lot.blend.take': 'Honey taken for a blend',
  'lot.blend.parts': 'Blend parts',
  'lot.stage.extracted': 'Marked extracted',
  'lot.stage.released': 'Released',
  'lot.stage.held': 'Held',
  'lot.stage.packed_out': 'Packed out',
  'lot.release_override': 'Released from held by the owner',
  'lot.unhold': 'Taken out of held',
};

function summary(value: unknown): string {
  if (!value || typeof value !== 'object') return '';
  return Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== null && v !== undefined && v !== '')
    .map(([k, v]) => `${k}: ${typeof v === 'object' ? JSON.stringify(v) : String(v)}`)
    .join(' · ');
}

/** The lot's audit trail, newest first: who, when, what changed and why. */
export function LotHistory({ rows, timeZone }: { rows: AuditRow[]; timeZone: string }) {
  const when = new Intl.DateTimeFormat('en-GB', { timeZone, dateStyle: 'medium', timeStyle: 'short' });
  if (!rows.length) return <p className="hint">No history yet.</p>;
  return (
    <ol className="space-y-2 text-sm" aria-label="Lot history">
      {rows.map((r) => (
        <li key={r.id} className="border-b border-line pb-2">
          <div>
            <strong>{ACTIONS[r.action] ?? r.action}</strong> · {r.actorName ?? 'system'} ·{' '}
            <time dateTime={new Date(r.createdAt).toISOString()}>{when.format(new Date(r.createdAt))}</time>
          </div>
          {r.before ? <div className="break-words text-ink-soft">Before: {summary(r.before)}</div> : null}
          {r.after ? <div className="break-words text-ink-soft">After: {summary(r.after)}</div> : null}
          {r.reason ? <div>Reason: {r.reason}</div> : null}
        </li>
      ))}
    </ol>
  );
}
