import { listRoute } from '@/lib/http/list-route';
import { listYards } from '@/lib/data/yards/yards';
import { yardListQuery } from '@/lib/schemas/yards';

export const dynamic = 'force-dynamic';

/** Yards the caller may see, paginated: ?page&pageSize(≤100)&sort=name|colonies&dir&q */
export const GET = listRoute('yards.read', yardListQuery, listYards);
