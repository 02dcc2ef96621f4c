import type { ActionResult } from '@/lib/schemas/result';

/**
 * Posts to a route handler and turns its JSON answer into the same `ActionResult` a server action
 * gives, so upload and checkout forms use `useActionForm` like the rest: `{ error, fieldErrors }`
 * (lib/http/json.ts) becomes a refusal, anything else the data. A `FormData` body goes as a
 * multipart form (a file upload); any other body as JSON.
 */
export async function postForm<T>(
  url: string,
  body: FormData | object,
  failed: (status: number) => string,
): Promise<ActionResult<T>> {
  const init: RequestInit =
    body instanceof FormData
      ? { method: 'POST', body }
      : { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) };
  const res = await fetch(url, init);
  const json = (await res.json().catch(() => ({}))) as { error?: string; fieldErrors?: Record<string, string> };
  if (!res.ok) return { ok: false, message: json.error ?? failed(res.status), fieldErrors: json.fieldErrors };
  return { ok: true, data: json as unknown } as ActionResult<T>;
}
