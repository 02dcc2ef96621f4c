import { listRoute } from '@/lib/http/list-route';
import { listOrders } from '@/lib/data/orders/list';
import { orderListQuery } from '@/lib/schemas/orders';

export const dynamic = 'force-dynamic';

/** The order desk, paginated: ?page&pageSize(≤100)&sort=createdAt|totalCents&dir&status=open|all|<status>&q */
export const GET = listRoute('orders.desk', orderListQuery, listOrders);
