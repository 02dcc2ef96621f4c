import { listRoute } from '@/lib/http/list-route';
import { listColonies } from '@/lib/data/colonies/read';
import { colonyListQuery } from '@/lib/schemas/colonies';

export const dynamic = 'force-dynamic';

/** Colonies in the caller's yards: ?page&pageSize(≤100)&sort=code|yard|status|queenYear&dir&yardId&status&q */
export const GET = listRoute('colonies.read', colonyListQuery, listColonies);
