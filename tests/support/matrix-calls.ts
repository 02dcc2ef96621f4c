/** Helpers to call actions and route handlers directly, the way the permission and fuzz tests do. */
export type ActionFn = (input: unknown) => Promise<unknown>;
export type RouteFn = (
  req: Request,
  ctx: { params: Promise<Record<string, string | string[]>> },
) => Promise<Response> | Response;

/** An auth refusal from guardedAction/authorize: "Please sign in first." or "…not allowed…". */
export function isAuthRefusal(result: unknown): boolean {
  if (!result || typeof result !== 'object') return false;
  const r = result as { ok?: boolean; message?: string };
  return r.ok === false && /sign in first|not allowed to do that|another site/i.test(r.message ?? '');
}

export function routeRefused(status: number): boolean {
  return status === 401 || status === 403 || status === 404;
}

/** Fills each dynamic segment ([id], [code], [...rest]) with a value that matches nothing. */
export function paramsFor(file: string): Record<string, string | string[]> {
  const params: Record<string, string | string[]> = {};
  for (const m of file.matchAll(/\[(\.\.\.)?([^\]]+)\]/g)) params[m[2]] = m[1] ? ['none'] : '999999';
  return params;
}

export function urlFor(file: string, params: Record<string, string | string[]>): string {
  const path = file
    .replace(/^app/, '')
    .replace(/\/route\.ts$/, '')
    .replace(/\/\([^)]+\)/g, '')
    .replace(/\[(\.\.\.)?([^\]]+)\]/g, (_, __, name: string) => [params[name]].flat().join('/'));
  return `http://127.0.0.1:3100${path}`;
}

export async function callRoute(file: string, method: string, fn: RouteFn, body: unknown, query = ''): Promise<number> {
  const params = paramsFor(file);
  const init: RequestInit = { method, headers: { 'content-type': 'application/json' } };
  if (method !== 'GET' && method !== 'HEAD') init.body = typeof body === 'string' ? body : JSON.stringify(body);
  try {
    const res = await fn(new Request(urlFor(file, params) + query, init), { params: Promise.resolve(params) });
    return res.status;
  } catch (err) {
    // redirect()/notFound() from next/navigation are stubbed to throw in tests.
    const e = err as { redirectTo?: string; notFound?: boolean };
    if (e.notFound) return 404;
    if (e.redirectTo)
      return e.redirectTo.startsWith('/sign-in') ? 401 : e.redirectTo.startsWith('/forbidden') ? 403 : 303;
    return 500;
  }
}
