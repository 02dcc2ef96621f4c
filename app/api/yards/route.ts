import { authorize } from '@/lib/auth/session';
import { handleRouteError } from '@/lib/http/json';
import { listYards } from '@/lib/data/yards';
import { queryRecord, yardListQuery } from '@/lib/schemas/harvest';

export const dynamic = 'force-dynamic';

/** Yards the caller may see, paginated: ?page&pageSize(≤100)&sort=name|colonies&dir&q */
export async function GET(req: Request) {
  try {
    const user = await authorize('yards.read');
    const query = yardListQuery.parse(queryRecord(new URL(req.url).searchParams));
    return Response.json(await listYards(user, query), { headers: { 'Cache-Control': 'no-store' } });
  } catch (err) {
    return handleRouteError(err);
  }
}
