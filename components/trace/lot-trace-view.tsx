import type { LotTrace } from '@/lib/data/trace/trace';
import { formatWeight, type UnitSystem } from '@/lib/domain/units';
import { Chip, type ChipTone } from '@/components/ui/chip';
import { Caution } from '@/components/ui/caution';

const STAGE_TONE: Record<string, ChipTone> = {
  released: 'ok',
  packed_out: 'neutral',
  held: 'bad',
  gathering: 'info',
  extracted: 'info',
};

function Table({
  caption,
  head,
  rows,
  empty,
}: {
  caption: string;
  head: string[];
  rows: React.ReactNode[][];
  empty: string;
}) {
  return (
    <div className="flex flex-col gap-1">
      <h4 className="font-heading font-semibold">{caption}</h4>
      {rows.length === 0 ? (
        <p className="hint">{empty}</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="data-table">
            <caption className="sr-only">{caption}</caption>
            <thead>
              <tr>
                {head.map((h) => (
                  <th key={h} scope="col">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {rows.map((r, i) => (
                <tr key={i}>
                  {r.map((c, j) => (
                    <td key={j}>{c}</td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}

/** One lot with its graph one step back (where the honey came from) and one step forward (where it went). */
export function LotTraceView({ t, system }: { t: LotTrace; system: UnitSystem }) {
  const w = (g: number | null) => (g === null ? '—' : formatWeight(g, system));
  const customers = new Set(t.recall.map((r) => r.email)).size;
  return (
    <article className="flex flex-col gap-5 card" aria-labelledby={`lot-${t.lot.id}`}>
      <header className="flex flex-wrap items-center gap-3">
        <h2 id={`lot-${t.lot.id}`}>Lot {t.lot.code}</h2>
        <Chip tone={STAGE_TONE[t.lot.stage] ?? 'neutral'}>{t.lot.stage.replace('_', ' ')}</Chip>
        {t.lot.isBlend ? <Chip tone="info">blend</Chip> : null}
        <span className="text-ink-soft">
          {t.lot.floralSource || 'no floral source'} · net {w(t.lot.netGrams)} · used {w(t.lot.usedGrams)}
          {t.lot.waterPct !== null ? ` · water ${t.lot.waterPct.toFixed(1)}%` : ''}
          {t.lot.extractedOn ? ` · extracted ${t.lot.extractedOn}` : ''}
          {t.lot.bestBeforeOn ? ` · best before ${t.lot.bestBeforeOn}` : ''}
        </span>
      </header>

      <section className="flex flex-col gap-4" aria-label="One step back">
        <h3>One step back: where it came from</h3>
        <Table
          caption="Colonies"
          head={['Colony', 'Yard', 'Keeper', 'Supers']}
          empty="No supers were scanned into this lot."
          rows={t.colonies.map((c) => [c.code, c.yardName, c.keeperName, c.supers])}
        />
        <Table
          caption="Supers"
          head={['Tag', 'Colony', 'Depth', 'Put on', 'Pulled', 'Full', 'Empty', 'Check']}
          empty="No supers."
          rows={t.supers.map((s) => [
            s.tagCode ?? '—',
            s.colonyCode,
            s.depth,
            s.putOnOn ?? '—',
            s.pulledOn ?? '—',
            w(s.fullGrams),
            w(s.emptyGrams),
            s.flagged ? <Chip tone="bad">flagged</Chip> : <Chip tone="ok">clear</Chip>,
          ])}
        />
        <Table
          caption="Feedings and treatments while its supers were on"
          head={['Colony', 'Record', 'What', 'From', 'To']}
          empty="None recorded."
          rows={t.events.map((e) => [
            e.colonyCode,
            <Chip key="k" tone={e.kind === 'treatment' ? 'warn' : 'info'}>
              {e.kind}
            </Chip>,
            e.what,
            e.fromOn,
            e.toOn ?? 'still on',
          ])}
        />
        {t.events.some((e) => e.kind === 'treatment') ? (
          <Caution>
            A treatment&apos;s product label governs whether honey supers may be on and for how long after; follow it
            and local law.
          </Caution>
        ) : null}
        <Table
          caption="Parent lots (this lot is a blend of)"
          head={['Lot', 'Taken']}
          empty="Not a blend."
          rows={t.parents.map((p) => [p.code, w(p.grams)])}
        />
      </section>

      <section className="flex flex-col gap-4" aria-label="One step forward">
        <h3>One step forward: where it went</h3>
        <Table
          caption="Child lots (blends made from it)"
          head={['Lot', 'Taken']}
          empty="No blends made from it."
          rows={t.children.map((c) => [c.code, w(c.grams)])}
        />
        <Table
          caption="Jarring runs"
          head={['Run on', 'Product', 'Jars', 'Fill check']}
          empty="Not jarred yet."
          rows={t.jarringRuns.map((j) => [
            j.runOn,
            j.productName,
            j.jarCount,
            j.fillPass ? <Chip tone="ok">pass</Chip> : <Chip tone="bad">fail</Chip>,
          ])}
        />
        <Table
          caption="Stock"
          head={['Product', 'On hand', 'Reserved', 'Best before']}
          empty="No stock."
          rows={t.stock.map((s) => [s.productName, s.onHand, s.reserved, s.bestBeforeOn])}
        />
        <div className="flex flex-wrap items-center justify-between gap-2">
          <p className="font-medium">
            Recall list: {customers} customers, {t.recall.reduce((a, r) => a + r.jars, 0)} jars
          </p>
          <div className="flex gap-2">
            <a className="btn-secondary min-h-11" href={`/api/trace/recall?lot=${t.lot.id}&format=csv`} download>
              Recall list CSV
            </a>
            <a className="btn-secondary min-h-11" href={`/api/trace/recall?lot=${t.lot.id}&format=pdf`} download>
              Recall list PDF
            </a>
          </div>
        </div>
        <Table
          caption="Orders and customers"
          head={['Order', 'Status', 'Customer', 'E-mail', 'Phone', 'Lot', 'Product', 'Jars']}
          empty="No jars of this lot were sold."
          rows={t.recall.map((r) => [
            r.orderNumber,
            r.status.replace('_', ' '),
            r.customerName,
            r.email,
            r.phone || '—',
            r.lotCode,
            r.productName,
            r.jars,
          ])}
        />
      </section>
    </article>
  );
}
