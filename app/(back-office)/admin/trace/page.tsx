import { requirePermission } from '@/lib/auth/session';
import { traceInput } from '@/lib/data/trace/trace';
import { getSettings } from '@/lib/data/settings/settings';
import { PageHeader } from '@/components/ui/page-header';
import { LotTraceView } from '@/components/trace/lot-trace-view';

export const metadata = { title: 'Trace' };

export default async function TracePage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  await requirePermission('trace.read', '/admin/trace');
  const raw = (await searchParams).q;
  const q = (Array.isArray(raw) ? raw[0] : (raw ?? '')).slice(0, 200);
  const [result, settings] = await Promise.all([q.trim() ? traceInput(q) : Promise.resolve(null), getSettings()]);
  const m = result?.match;
  return (
    <>
      <PageHeader title="Trace" lead="Enter or scan a lot code, a jar barcode, a super tag or an order number." />
      <form method="get" className="mb-6 flex flex-wrap items-end gap-3 card" role="search">
        <label className="field min-w-64 flex-1">
          <span>Lot, jar barcode, super tag or order</span>
          <input
            name="q"
            className="input min-h-11"
            defaultValue={q}
            autoFocus
            autoComplete="off"
            spellCheck={false}
            maxLength={200}
            placeholder="HH26-014 or (01)…(10)HH26-014"
          />
        </label>
        <button type="submit" className="btn-primary min-h-11">
          Trace
        </button>
      </form>
      {result ? (
        <div className="flex flex-col gap-6">
          <p role="status" className="flex flex-wrap gap-x-4">
            <span className="font-medium">{m ? m.label : `Nothing found for “${q.trim()}”.`}</span>
            <span className="text-ink-soft" data-testid="trace-ms">
              Traced in {result.ms} ms
            </span>
          </p>
          {m?.kind === 'jar' ? (
            <p className="hint">
              GTIN {m.gtin ?? '—'} · best before {m.bestBefore ?? '—'}
            </p>
          ) : null}
          {m?.kind === 'order' ? (
            <p className="hint">
              Order {m.order.number} · {m.order.status.replace('_', ' ')} · {m.order.name} · {m.order.email} · placed{' '}
              {m.order.createdAt}
            </p>
          ) : null}
          {m?.kind === 'super' ? (
            <ul className="hint">
              {m.pulls.map((p) => (
                <li key={p.id}>
                  On colony {p.colonyCode}, pulled {p.pulledOn ?? 'not yet'},{' '}
                  {p.voided ? 'voided by its keeper (recorded by mistake)' : `into lot ${p.lotCode ?? 'none yet'}`}
                </li>
              ))}
            </ul>
          ) : null}
          {result.lots.map((t) => (
            <LotTraceView key={t.lot.id} t={t} system={settings.weightSystem} />
          ))}
        </div>
      ) : null}
    </>
  );
}
