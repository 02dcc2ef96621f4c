import { Chip, type ChipTone } from '@/components/ui/chip';
import type { OrderStatus } from '@/lib/domain/order-status';

const LOOK: Record<OrderStatus, { label: string; tone: ChipTone }> = {
  awaiting_payment: { label: 'Awaiting payment', tone: 'warn' },
  paid: { label: 'Paid', tone: 'ok' },
  packed: { label: 'Packed', tone: 'info' },
  shipped: { label: 'Shipped', tone: 'info' },
  picked_up: { label: 'Picked up', tone: 'neutral' },
  cancelled: { label: 'Cancelled', tone: 'neutral' },
  expired: { label: 'Expired', tone: 'neutral' },
  refunded: { label: 'Refunded', tone: 'neutral' },
};

export function OrderStatusChip({ status, needsRefund = false }: { status: OrderStatus; needsRefund?: boolean }) {
  if (needsRefund) return <Chip tone="bad">Paid late — refund</Chip>;
  const look = LOOK[status];
  return <Chip tone={look.tone}>{look.label}</Chip>;
}

export const STATUS_LABEL = (s: OrderStatus) => LOOK[s].label;
