import { authorize } from '@/lib/auth/session';
import { handleRouteError, jsonError } from '@/lib/http/json';
import { getYard } from '@/lib/data/yards';

export const dynamic = 'force-dynamic';

export async function GET(_req: Request, ctx: { params: Promise<{ id: string }> }) {
  try {
    const user = await authorize('yards.read');
    const yard = await getYard(user, Number((await ctx.params).id));
    if (!yard) return jsonError(404, 'No such yard.');
    return Response.json(yard, { headers: { 'Cache-Control': 'no-store' } });
  } catch (err) {
    return handleRouteError(err);
  }
}
