import type { TraceRow } from '@/lib/data/lots/detail';
import { Chip } from '@/components/ui/chip';
import { TableHead } from '@/components/ui/table-parts';

/** Upstream trace: each super with its colony, yard and keeper, and feedings/treatments while it was on. */
export function LotTrace({ rows }: { rows: TraceRow[] }) {
  if (!rows.length) return <p className="hint">No supers behind this lot yet.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="data-table">
        <caption className="sr-only">Supers, colonies, yards and keepers behind this lot</caption>
        <TableHead
          columns={['Super', 'Colony', 'Yard', 'Keeper', 'On the hive', 'Feedings and treatments meanwhile']}
        />
        <tbody>
          {rows.map((r) => (
            <tr key={r.id}>
              <td className="font-mono">
                {r.tagCode ?? `#${r.id}`}
                {r.viaLot ? <span className="hint"> via {r.viaLot}</span> : null}
              </td>
              <td>{r.colonyCode}</td>
              <td>{r.yardName}</td>
              <td>{r.keeperName}</td>
              <td>
                {r.putOnOn ?? '?'} – {r.pulledOn ?? 'on'}
              </td>
              <td>
                {r.events.length === 0 ? (
                  <span className="hint">none recorded</span>
                ) : (
                  <ul className="space-y-1">
                    {r.events.map((e, i) => (
                      <li key={i}>
                        <Chip tone={e.kind === 'treatment' ? 'warn' : 'info'}>{e.kind}</Chip> {e.what}, {e.from} –{' '}
                        {e.to ?? 'not ended'}
                      </li>
                    ))}
                  </ul>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
