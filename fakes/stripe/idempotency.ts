// Idempotent POSTs (docs.stripe.com/api/idempotent_requests): the first result for
// (key, path, parameters) is saved and replayed; other parameters → 400 idempotency_error; a request
// with the same key still running → 409 (from memory). Nothing is saved when validation fails (our 400/404s).
import { createHash } from 'node:crypto';
import { ApiError } from './errors';
import { canonical, type Params } from './params';

export type ApiResult = { status: number; body: unknown };

type Saved = ApiResult & { path: string; hash: string; savedAt: number };

const MAX_KEY_LENGTH = 255;
const KEEP_MS = 24 * 60 * 60 * 1000;

function mismatch(key: string): ApiError {
  return new ApiError(
    400,
    'idempotency_error',
    `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
  );
}

export class IdempotencyStore {
  private saved = new Map<string, Saved>();
  private running = new Map<string, { path: string; hash: string }>();

  /** `scope` is the API key: Stripe keeps keys per account. */
  async run(
    scope: string,
    key: string | undefined,
    path: string,
    params: Params,
    handler: () => Promise<ApiResult>,
  ): Promise<ApiResult & { replayed: boolean }> {
    if (key === undefined) return { ...(await handler()), replayed: false };
    if (key.length > MAX_KEY_LENGTH) {
      throw new ApiError(
        400,
        'invalid_request_error',
        `Idempotency key is longer than ${MAX_KEY_LENGTH} characters.`,
        'idempotency_key_too_long',
      );
    }
    const id = `${scope}\u0000${key}`;
    const hash = createHash('sha256').update(canonical(params)).digest('hex');
    const saved = this.saved.get(id);
    if (saved && Date.now() - saved.savedAt < KEEP_MS) {
      if (saved.path !== path || saved.hash !== hash) throw mismatch(key);
      return { status: saved.status, body: saved.body, replayed: true };
    }
    const other = this.running.get(id);
    if (other) {
      if (other.path !== path || other.hash !== hash) throw mismatch(key);
      // [mem] Stripe answers 409 here; the SDK retries 409s (src/RequestSender.ts `_shouldRetry`).
      throw new ApiError(
        409,
        'idempotency_error',
        'There is currently another in-progress request using this idempotency key. Please try again later.',
        'idempotency_key_in_use',
      );
    }
    this.running.set(id, { path, hash });
    let result: ApiResult;
    try {
      result = await handler();
    } catch (err) {
      result = err instanceof ApiError ? { status: err.status, body: err.body() } : internalError(err);
    } finally {
      this.running.delete(id);
    }
    // Validation failures never started the endpoint, so a corrected retry may reuse the key.
    if (result.status !== 400 && result.status !== 404)
      this.saved.set(id, { ...result, path, hash, savedAt: Date.now() });
    return { ...result, replayed: false };
  }

  clear(): void {
    this.saved.clear();
    this.running.clear();
  }
}

export function internalError(err: unknown): ApiResult {
  const message = err instanceof Error ? err.message : String(err);
  return { status: 500, body: new ApiError(500, 'api_error', `Fake internal error: ${message}`).body() };
}
