import { listRoute } from '@/lib/http/list-route';
import { listCustomerOrders } from '@/lib/data/orders/list';
import { customerOrderListQuery } from '@/lib/schemas/orders';

export const dynamic = 'force-dynamic';

/** The signed-in customer's own orders, newest first: ?page&pageSize(≤100)&dir */
export const GET = listRoute('orders.own', customerOrderListQuery, listCustomerOrders);
