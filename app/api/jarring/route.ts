import { listRoute } from '@/lib/http/list-route';
import { listJarringRuns } from '@/lib/data/jarring/read';
import { jarringRunListQuery } from '@/lib/schemas/jarring';

export const dynamic = 'force-dynamic';

/** Jarring runs, newest first: ?page&pageSize(≤100)&sort=runOn&dir&lotId */
export const GET = listRoute('jarring.read', jarringRunListQuery, listJarringRuns);
