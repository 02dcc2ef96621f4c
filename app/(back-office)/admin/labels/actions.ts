'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/server-action';
import { labelLayoutIdInput, labelLayoutInput } from '@/lib/schemas/labels';
import { deleteLabelLayout, saveLabelLayout } from '@/lib/data/labels/layouts';

export const saveLabelLayoutAction = guardedAction('labels.layouts', labelLayoutInput, async (user, data) => {
  const saved = await saveLabelLayout(user.id, data);
  revalidatePath('/admin/labels');
  return { ok: true, data: saved };
});

export const deleteLabelLayoutAction = guardedAction('labels.layouts', labelLayoutIdInput, async (user, data) => {
  await deleteLabelLayout(user.id, data.layoutId);
  revalidatePath('/admin/labels');
  return { ok: true };
});
