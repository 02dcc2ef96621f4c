import 'server-only';
import { headers } from 'next/headers';
import type { z } from 'zod';
import { authorize, AuthError, type SessionUser } from '@/lib/auth/session';
import type { Permission } from '@/lib/auth/roles';
import { fail, toFieldErrors, type ActionResult } from '@/lib/schemas/result';
import { assertSameOrigin, OriginError } from './origin';
import { HttpError } from './json';
import { DomainError } from '@/lib/domain/errors';
import { containsNul } from '@/lib/schemas/fields';

/**
 * Builds a server action that checks, in order: same origin, the signed-in user's permission
 * (re-read from the database), then the input with zod. Known errors become a readable
 * `{ ok: false, message }`; nothing is written before all three pass.
 */
export function guardedAction<S extends z.ZodType, R = undefined>(
  permission: Permission,
  schema: S,
  run: (user: SessionUser, data: z.output<S>) => Promise<ActionResult<R>>,
): (input: z.input<S>) => Promise<ActionResult<R>> {
  return async (input) => {
    try {
      await assertSameOrigin(await headers());
      const user = await authorize(permission);
      // PostgreSQL refuses U+0000 in text; a field schema that forgot plainText() must not turn it into a 500.
      if (containsNul(input)) return fail('Some text contains a character that is not allowed (NUL).');
      const parsed = schema.safeParse(input);
      if (!parsed.success) return fail('Please fix the marked fields.', toFieldErrors(parsed.error));
      return await run(user, parsed.data);
    } catch (err) {
      if (
        err instanceof AuthError ||
        err instanceof OriginError ||
        err instanceof HttpError ||
        err instanceof DomainError
      )
        return fail(err.message);
      throw err;
    }
  };
}
