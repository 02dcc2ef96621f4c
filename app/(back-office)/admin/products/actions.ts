'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/server-action';
import { productInput } from '@/lib/schemas/products';
import { saveProduct } from '@/lib/data/products/products';

export const saveProductAction = guardedAction('products.manage', productInput, async (user, data) => {
  const row = await saveProduct(user.id, data);
  revalidatePath('/admin/products');
  return { ok: true, data: { id: row.id, gtin: row.gtin } };
});
