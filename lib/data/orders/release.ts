import 'server-only';
import type { Transaction } from 'sequelize';
import type { Order } from '@/models/order';
import { recordAudit } from '@/lib/data/audit';
import { releaseReserved } from './stock';

/** Releases a locked, unpaid order's reservation and closes it, inside the caller's transaction. */
export async function releaseReservedLocked(t: Transaction, order: Order, status: 'expired' | 'cancelled', actorUserId: number | null, reason: string): Promise<number> {
  const jars = await releaseReserved(t, order.id);
  await order.update({ status, reservedUntil: null }, { transaction: t });
  await recordAudit({ actorUserId, action: `order.${status}`, entityType: 'order', entityId: order.id, before: { status: 'awaiting_payment' }, after: { status, jarsReleased: jars }, reason }, t);
  return jars;
}
