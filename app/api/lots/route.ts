import { listRoute } from '@/lib/http/list-route';
import { listLots } from '@/lib/data/lots/lots';
import { lotListQuery } from '@/lib/schemas/lots';

export const dynamic = 'force-dynamic';

/** One page of lots as JSON (?page, pageSize, sort, dir, stage, year, floral); keepers get only their own. */
export const GET = listRoute('lots.read', lotListQuery, listLots);
