import { authorize } from '@/lib/auth/session';
import { listLots } from '@/lib/data/lots/lots';
import { lotListQuery } from '@/lib/schemas/lots';
import { handleRouteError } from '@/lib/http/json';

export const dynamic = 'force-dynamic';

/** One page of lots as JSON (?page, pageSize, stage, year, floral); keepers get only their own. */
export async function GET(req: Request) {
  try {
    const user = await authorize('lots.read');
    const params = Object.fromEntries(new URL(req.url).searchParams);
    const q = lotListQuery.parse(params);
    return Response.json(await listLots(user, q), { headers: { 'Cache-Control': 'no-store' } });
  } catch (err) {
    return handleRouteError(err);
  }
}
