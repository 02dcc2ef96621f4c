import { listRoute } from '@/lib/http/list-route';
import { listLedger } from '@/lib/data/stock/stock';
import { ledgerListQuery } from '@/lib/schemas/stock';

export const dynamic = 'force-dynamic';

/** The stock ledger, newest first: ?page&pageSize(≤100)&dir&productId&lotId */
export const GET = listRoute('stock.read', ledgerListQuery, listLedger);
