'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/server-action';
import { stockAdjustInput } from '@/lib/schemas/stock';
import { adjustStock } from '@/lib/data/stock/stock';

export const adjustStockAction = guardedAction('stock.adjust', stockAdjustInput, async (user, data) => {
  const level = await adjustStock(user.id, data);
  revalidatePath('/admin/stock');
  return { ok: true, data: { onHand: level.onHand } };
});
