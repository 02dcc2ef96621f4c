import type { ActionResult } from '@/lib/schemas/result';

/**
 * Posts a multipart form (a file upload) to a route handler and turns its JSON answer into the
 * same `ActionResult` a server action gives, so upload forms use `useActionForm` like the rest:
 * `{ error, fieldErrors }` (lib/http/json.ts) becomes a refusal, anything else the data.
 */
export async function postForm<T>(url: string, body: FormData, failed: (status: number) => string): Promise<ActionResult<T>> {
  const res = await fetch(url, { method: 'POST', body });
  const json = (await res.json().catch(() => ({}))) as { error?: string; fieldErrors?: Record<string, string> };
  if (!res.ok) return { ok: false, message: json.error ?? failed(res.status), fieldErrors: json.fieldErrors };
  return { ok: true, data: json as unknown } as ActionResult<T>;
}
