import type { ReportTable } from '@/lib/reports/season-tables';

/** One season-report table, server-rendered, with its CSV download. */
export function ReportTableView({
  table,
  csvHref,
  empty = 'No rows.',
  folded = false,
}: {
  table: ReportTable;
  csvHref: string;
  empty?: string;
  folded?: boolean;
}) {
  const body =
    table.rows.length === 0 ? (
      <p className="hint">{empty}</p>
    ) : (
      <div className="overflow-x-auto card p-0">
        <table className="data-table">
          <caption className="sr-only">{table.title}</caption>
          <thead>
            <tr>
              {table.columns.map((c, i) => (
                <th key={c} scope="col" className={table.numeric[i] ? 'num' : undefined}>
                  {c}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {table.rows.map((r) => (
              <tr key={r.id}>
                {r.cells.map((cell, i) =>
                  i === 0 ? (
                    <th key={i} scope="row" className="font-medium">
                      {cell}
                    </th>
                  ) : (
                    <td key={i} className={table.numeric[i] ? 'num' : undefined}>
                      {cell}
                    </td>
                  ),
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    );
  return (
    <section className="flex flex-col gap-2" aria-labelledby={`t-${table.key}`}>
      <div className="flex flex-wrap items-end justify-between gap-2">
        <h2 id={`t-${table.key}`}>{table.title}</h2>
        <a className="btn-quiet min-h-11" href={csvHref} download>
          Download CSV<span className="sr-only">: {table.title}</span>
        </a>
      </div>
      {folded && table.rows.length > 0 ? (
        <details>
          <summary className="min-h-11 cursor-pointer py-2">Show {table.rows.length} rows</summary>
          {body}
        </details>
      ) : (
        body
      )}
    </section>
  );
}
