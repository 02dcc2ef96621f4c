import { authorize } from '@/lib/auth/session';
import { handleRouteError } from '@/lib/http/json';
import { listColonies } from '@/lib/data/colonies';
import { colonyListQuery, queryRecord } from '@/lib/schemas/harvest';

export const dynamic = 'force-dynamic';

/** Colonies in the caller's yards: ?page&pageSize(≤100)&sort=code|yard|status|queenYear&dir&yardId&status&q */
export async function GET(req: Request) {
  try {
    const user = await authorize('colonies.read');
    const query = colonyListQuery.parse(queryRecord(new URL(req.url).searchParams));
    return Response.json(await listColonies(user, query), { headers: { 'Cache-Control': 'no-store' } });
  } catch (err) {
    return handleRouteError(err);
  }
}
