import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { Page } from '@/lib/schemas/list-query';
import type { CustomerOrderListQuery, OrderListQuery } from '@/lib/schemas/orders';
import type { Order } from '@/models/order';
import type { OrderStatus } from '@/lib/domain/order-status';
import { needsRefund } from './read';

export type OrderListRow = {
  id: number;
  number: string;
  status: OrderStatus;
  fulfilment: string;
  name: string;
  email: string;
  totalCents: number;
  refundedCents: number;
  currency: string;
  createdAt: string;
  jars: number;
  needsRefund: boolean;
};

function listRow(o: Order): OrderListRow {
  return {
    id: o.id,
    number: o.number,
    status: o.status,
    fulfilment: o.fulfilment,
    name: o.name,
    email: o.email,
    totalCents: o.totalCents,
    refundedCents: o.refundedCents,
    currency: o.currency,
    createdAt: new Date(o.createdAt).toISOString(),
    jars: (o.lines ?? []).reduce((s, l) => s + l.quantity, 0),
    needsRefund: needsRefund(o),
  };
}

async function orderPage(
  where: WhereOptions<Order>,
  q: { page: number; pageSize: number; sort: 'createdAt' | 'totalCents'; dir: 'asc' | 'desc' },
): Promise<Page<OrderListRow>> {
  const { Order, OrderLine } = getDb().models;
  const [total, rows] = await Promise.all([
    Order.count({ where }),
    Order.findAll({
      where,
      include: [{ model: OrderLine, as: 'lines', attributes: ['quantity'] }],
      order: [
        [q.sort, q.dir],
        ['id', q.dir],
      ],
      limit: q.pageSize,
      offset: (q.page - 1) * q.pageSize,
    }),
  ]);
  return { rows: rows.map(listRow), total, page: q.page, pageSize: q.pageSize };
}

/** The order desk (the caller checked orders.desk): every order, filtered by status and by number, name or e-mail. */
export async function listOrders(_user: SessionUser, query: OrderListQuery): Promise<Page<OrderListRow>> {
  const and: WhereOptions<Order>[] = [];
  if (query.status === 'open') and.push({ status: ['paid', 'packed'] });
  else if (query.status !== 'all') and.push({ status: query.status });
  if (query.q) {
    const like = `%${query.q.replace(/[%_\\]/g, '\\$&')}%`;
    and.push({
      [Op.or]: [{ number: { [Op.iLike]: like } }, { email: { [Op.iLike]: like } }, { name: { [Op.iLike]: like } }],
    });
  }
  return orderPage(and.length ? { [Op.and]: and } : {}, query);
}

/** A customer's own orders; anyone else has none here. */
export async function listCustomerOrders(
  user: SessionUser,
  query: CustomerOrderListQuery,
): Promise<Page<OrderListRow>> {
  if (user.role !== 'customer') return { rows: [], total: 0, page: query.page, pageSize: query.pageSize };
  return orderPage({ customerId: user.id }, query);
}
