'use client';
import { useEffect, useMemo, useRef, useState } from 'react';
import {
  createColumnHelper,
  rowSortingFeature,
  tableFeatures,
  useTable,
  type SortingState,
} from '@tanstack/react-table';
import { ChevronDown, ChevronUp, ChevronsUpDown } from 'lucide-react';
import type { Page } from '@/lib/schemas/list-query';

export type DataColumn<Row> = {
  id: string;
  header: string;
  /** Right-aligned tabular figures. */
  numeric?: boolean;
  sortable?: boolean;
  cell: (row: Row) => React.ReactNode;
};

const features = tableFeatures({ rowSortingFeature });

/**
 * A server-paginated, server-sorted table (@tanstack/react-table v9 for the header/sort model).
 * Rows come from a JSON route answering a `Page` (`{ rows, total, page, pageSize }`, a `listRoute`);
 * the first page is rendered on the server and passed in as `initial` (its page and page size are
 * kept), so nothing is fetched until the user pages or sorts. New filters start again at page 1.
 */
export function DataTable<Row extends { id: number | string }>({
  endpoint,
  columns,
  caption,
  filters = {},
  initial,
  initialSort,
  pageSize = initial?.pageSize ?? 25,
  empty = 'Nothing here yet.',
  rowClassName,
}: {
  endpoint: string;
  columns: DataColumn<Row>[];
  caption: string;
  filters?: Record<string, string>;
  initial?: Page<Row>;
  initialSort?: { id: string; desc: boolean };
  pageSize?: number;
  empty?: string;
  /** A class for a row that should stand out (e.g. a failed check). */
  rowClassName?: (row: Row) => string | undefined;
}) {
  const [sorting, setSorting] = useState<SortingState>(initialSort ? [initialSort] : []);
  const [page, setPage] = useState(initial?.page ?? 1);
  const [data, setData] = useState<Page<Row> | undefined>(initial);
  const [error, setError] = useState<string>();
  const [loading, setLoading] = useState(false);
  const first = useRef(Boolean(initial));
  const filterKey = JSON.stringify(filters);
  const shownFilters = useRef(filterKey);

  useEffect(() => {
    if (shownFilters.current === filterKey) return;
    shownFilters.current = filterKey;
    setPage(1);
  }, [filterKey]);
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    const ctrl = new AbortController();
    const params = new URLSearchParams({ ...JSON.parse(filterKey), page: String(page), pageSize: String(pageSize) });
    if (sorting[0]) {
      params.set('sort', sorting[0].id);
      params.set('dir', sorting[0].desc ? 'desc' : 'asc');
    }
    setLoading(true);
    fetch(`${endpoint}?${params}`, { signal: ctrl.signal })
      .then(async (res) => {
        const body = await res.json();
        if (!res.ok) throw new Error(body.error ?? 'Could not load the list.');
        setData(body as Page<Row>);
        setError(undefined);
      })
      .catch((err: Error) => {
        if (err.name !== 'AbortError') setError(err.message);
      })
      .finally(() => setLoading(false));
    return () => ctrl.abort();
  }, [endpoint, filterKey, page, pageSize, sorting]);

  const tableColumns = useMemo(() => {
    const helper = createColumnHelper<typeof features, Row>();
    // Accessor columns, not display ones: table-core only lets a column with an accessor sort.
    return helper.columns(
      columns.map((c) =>
        helper.accessor((row) => row.id, {
          id: c.id,
          header: c.header,
          enableSorting: Boolean(c.sortable),
          cell: ({ row }) => c.cell(row.original),
        }),
      ),
    );
  }, [columns]);

  const rows = data?.rows ?? EMPTY;
  const table = useTable({
    features,
    columns: tableColumns,
    data: rows,
    state: { sorting },
    onSortingChange: setSorting,
    manualSorting: true,
    getRowId: (r) => String(r.id),
  });
  const total = data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const byId = Object.fromEntries(columns.map((c) => [c.id, c]));

  return (
    <div className="overflow-hidden card p-0" aria-busy={loading}>
      <div className="overflow-x-auto">
        <table className="data-table">
          <caption className="sr-only">{caption}</caption>
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const col = byId[header.column.id];
                  const sorted = header.column.getIsSorted();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      className={col?.numeric ? 'num' : undefined}
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    >
                      {col?.sortable ? (
                        <button
                          type="button"
                          className="inline-flex items-center gap-1 font-semibold"
                          onClick={header.column.getToggleSortingHandler()}
                        >
                          {col.header}
                          {sorted === 'asc' ? (
                            <ChevronUp aria-hidden className="h-4 w-4" />
                          ) : sorted === 'desc' ? (
                            <ChevronDown aria-hidden className="h-4 w-4" />
                          ) : (
                            <ChevronsUpDown aria-hidden className="h-4 w-4 opacity-50" />
                          )}
                        </button>
                      ) : (
                        col?.header
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className={rowClassName?.(row.original)}>
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className={byId[cell.column.id]?.numeric ? 'num' : undefined}>
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
            {rows.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="py-6 text-center text-ink-soft">
                  {loading ? 'Loading…' : empty}
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center justify-between gap-2 border-t border-line px-3 py-2 text-sm">
        <span aria-live="polite">
          {error ? (
            <span className="field-error">{error}</span>
          ) : (
            `${total.toLocaleString()} in all · page ${page} of ${pages}`
          )}
        </span>
        <span className="flex gap-2">
          <button
            type="button"
            className="btn-secondary min-h-9 py-1"
            disabled={page <= 1 || loading}
            onClick={() => setPage((p) => p - 1)}
          >
            Previous
          </button>
          <button
            type="button"
            className="btn-secondary min-h-9 py-1"
            disabled={page >= pages || loading}
            onClick={() => setPage((p) => p + 1)}
          >
            Next
          </button>
        </span>
      </div>
    </div>
  );
}

const EMPTY: never[] = [];
