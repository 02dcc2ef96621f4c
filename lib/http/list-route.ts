import type { z } from 'zod';
import { authorize, type SessionUser } from '@/lib/auth/session';
import type { Permission } from '@/lib/auth/roles';
import { queryRecord } from '@/lib/schemas/list-query';
import { handleRouteError } from './json';

/**
 * A GET handler for one page of a list as JSON: the caller's permission, the query string through
 * its zod schema (blank parameters dropped), then `list` for that user; never cached.
 */
export function listRoute<Q>(
  permission: Permission,
  schema: z.ZodType<Q>,
  list: (user: SessionUser, query: Q) => Promise<unknown>,
) {
  return async function GET(req: Request): Promise<Response> {
    try {
      const user = await authorize(permission);
      const query = schema.parse(queryRecord(new URL(req.url).searchParams));
      return Response.json(await list(user, query), { headers: { 'Cache-Control': 'no-store' } });
    } catch (err) {
      return handleRouteError(err);
    }
  };
}
