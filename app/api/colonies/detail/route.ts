import { colonyDetailQuery } from '@/lib/schemas/colonies';
import { authorize } from '@/lib/auth/session';
import { handleRouteError, jsonError } from '@/lib/http/json';
import { getColony } from '@/lib/data/colonies/read';
import { listColonySupers } from '@/lib/data/supers/pulls';

export const dynamic = 'force-dynamic';

/** ?id=N: one colony with its supers; another keeper's colony is a 404, like one that does not exist. */
export async function GET(req: Request) {
  try {
    const user = await authorize('colonies.read');
    const { id } = colonyDetailQuery.parse(Object.fromEntries(new URL(req.url).searchParams));
    const colony = await getColony(user, id);
    if (!colony) return jsonError(404, 'No such colony.');
    return Response.json(
      { ...colony, supers: await listColonySupers(colony.id) },
      { headers: { 'Cache-Control': 'no-store' } },
    );
  } catch (err) {
    return handleRouteError(err);
  }
}
