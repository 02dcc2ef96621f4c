import { z } from 'zod';

export type ListQueryOptions = {
  /** The direction when the request names none (default asc). */
  defaultDir?: 'asc' | 'desc';
};

/**
 * Query string of a paginated list route: page (1-based), pageSize ≤ 100, sort from an allow-list,
 * dir asc|desc, plus the route's own filters. Unknown sort fields are refused, never passed to SQL.
 */
export function listQuery<const S extends readonly [string, ...string[]], F extends z.ZodRawShape>(
  sortFields: S,
  filters: F,
  defaultSort: S[number],
  options: ListQueryOptions = {},
) {
  return z.object({
    page: z.coerce.number().int().min(1, 'Page starts at 1.').max(100_000).default(1),
    pageSize: z.coerce.number().int().min(1).max(100, 'At most 100 rows per page.').default(25),
    sort: z.enum(sortFields, `Sort by one of: ${sortFields.join(', ')}.`).default(defaultSort as never),
    dir: z.enum(['asc', 'desc']).default(options.defaultDir ?? 'asc'),
    ...filters,
  });
}

/** One page of a list, as every list function returns it and every list route answers it. */
export type Page<Row> = { rows: Row[]; total: number; page: number; pageSize: number };

/** URLSearchParams or a Next searchParams object → a plain record with blanks dropped. */
export function queryRecord(
  params: URLSearchParams | Record<string, string | string[] | undefined>,
): Record<string, string> {
  const entries =
    params instanceof URLSearchParams
      ? [...params.entries()]
      : Object.entries(params).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v] as const);
  return Object.fromEntries(entries.filter((e): e is [string, string] => typeof e[1] === 'string' && e[1] !== ''));
}
