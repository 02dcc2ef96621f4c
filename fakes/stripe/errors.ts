// Error bodies the SDK turns into typed errors (SDK src/Error.ts `generateV1Error`):
// 400/404 → StripeInvalidRequestError (or StripeIdempotencyError by `type`), 402 → StripeCardError,
// 409/5xx → StripeAPIError.
import { randomBytes } from 'node:crypto';

const ALPHABET = 'abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789';

/** `cs_test_…`, `pi_…`: random base62 tails, long enough that tests never collide. */
export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let out = '';
  for (const b of bytes) out += ALPHABET[b % ALPHABET.length];
  return `${prefix}${out}`;
}

export const nowSeconds = (): number => Math.floor(Date.now() / 1000);

export type ErrorType =
  'invalid_request_error' | 'idempotency_error' | 'card_error' | 'api_error' | 'authentication_error';

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: ErrorType,
    message: string,
    readonly code?: string,
    readonly param?: string,
    readonly extra: Record<string, string> = {},
  ) {
    super(message);
  }

  body() {
    return { error: { type: this.type, code: this.code, message: this.message, param: this.param, ...this.extra } };
  }
}

export function invalid(message: string, param?: string, code = 'parameter_invalid'): ApiError {
  return new ApiError(400, 'invalid_request_error', message, code, param);
}

export function missingParam(param: string): ApiError {
  return new ApiError(400, 'invalid_request_error', `Missing required param: ${param}.`, 'parameter_missing', param);
}

/** A path id that does not exist is a 404; an id inside the parameters is a 400 on that param. */
export function noSuch(kind: string, id: string, param?: string): ApiError {
  return new ApiError(
    param ? 400 : 404,
    'invalid_request_error',
    `No such ${kind}: '${id}'`,
    'resource_missing',
    param ?? 'id',
  );
}

export function declined(): ApiError {
  return new ApiError(402, 'card_error', 'Your card was declined.', 'card_declined', undefined, {
    decline_code: 'generic_decline',
  });
}
