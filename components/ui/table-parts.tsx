import type { ReactNode } from 'react';

/** A column heading: its label, or with `num` (right-aligned figures) or `hidden` (named for screen readers only). */
export type Column = string | { label: string; num?: boolean; hidden?: boolean };

/** A column of figures, right-aligned. */
export const num = (label: string): Column => ({ label, num: true });

/** The head of a plain table (one that neither sorts nor pages; those are DataTables): a `th` per column. */
export function TableHead({ columns }: { columns: readonly Column[] }) {
  return (
    <thead>
      <tr>
        {columns.map((c) => {
          const { label, num, hidden } = typeof c === 'string' ? { label: c } : c;
          return (
            <th key={label} scope="col" className={num ? 'num' : undefined}>
              {hidden ? <span className="sr-only">{label}</span> : label}
            </th>
          );
        })}
      </tr>
    </thead>
  );
}

/** The row a plain table shows when it has none: `children` across all `columns`. */
export function EmptyRow({ columns, children }: { columns: number; children: ReactNode }) {
  return (
    <tr>
      <td colSpan={columns} className="hint">
        {children}
      </td>
    </tr>
  );
}
