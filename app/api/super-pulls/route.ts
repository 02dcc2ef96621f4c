import { authorize } from '@/lib/auth/session';
import { handleRouteError, readJson } from '@/lib/http/json';
import { assertSameOrigin } from '@/lib/http/origin';
import { listSuperPulls } from '@/lib/data/supers/pulls';
import { recordPulls } from '@/lib/data/supers/record';
import { pullBatch, pullListQuery } from '@/lib/schemas/supers';
import { listRoute } from '@/lib/http/list-route';

export const dynamic = 'force-dynamic';

/** Pulled supers: ?page&pageSize(≤100)&sort=pulledOn|colony|fullGrams&dir&yardId&colonyId&flagged=yes|no&from&to */
export const GET = listRoute('supers.read', pullListQuery, listSuperPulls);

/** Records pulls { entries: [...] }; each entry's idempotencyKey makes a retry safe. */
export async function POST(req: Request) {
  try {
    await assertSameOrigin(req.headers);
    const user = await authorize('supers.write');
    const data = pullBatch.parse(await readJson(req));
    return Response.json({ results: await recordPulls(user, data.entries) });
  } catch (err) {
    return handleRouteError(err);
  }
}
