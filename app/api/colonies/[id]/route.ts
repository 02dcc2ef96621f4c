import { authorize } from '@/lib/auth/session';
import { handleRouteError, jsonError } from '@/lib/http/json';
import { getColony } from '@/lib/data/colonies';
import { listColonySupers } from '@/lib/data/super-pulls';

export const dynamic = 'force-dynamic';

/** One colony with its supers; another keeper's colony is a 404, like one that does not exist. */
export async function GET(_req: Request, ctx: { params: Promise<{ id: string }> }) {
  try {
    const user = await authorize('colonies.read');
    const colony = await getColony(user, Number((await ctx.params).id));
    if (!colony) return jsonError(404, 'No such colony.');
    return Response.json({ ...colony, supers: await listColonySupers(colony.id) }, { headers: { 'Cache-Control': 'no-store' } });
  } catch (err) {
    return handleRouteError(err);
  }
}
