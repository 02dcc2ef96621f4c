import Link from 'next/link';

/** Server-side pagination links that keep the other query parameters. */
export function Pager({ path, params, page, pageSize, total }: { path: string; params: Record<string, string>; page: number; pageSize: number; total: number }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const href = (p: number) => `${path}?${new URLSearchParams({ ...params, page: String(p) }).toString()}`;
  return (
    <nav aria-label="Pages" className="mt-3 flex items-center justify-between gap-2 text-sm">
      <span className="hint">{total} in all · page {page} of {pages}</span>
      <span className="flex gap-2">
        {page > 1 ? <Link className="btn-secondary min-h-11" href={href(page - 1)}>Previous</Link> : null}
        {page < pages ? <Link className="btn-secondary min-h-11" href={href(page + 1)}>Next</Link> : null}
      </span>
    </nav>
  );
}
