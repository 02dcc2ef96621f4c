'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/action';
import { tagBatchInput } from '@/lib/schemas/harvest';
import { createTagBatch } from '@/lib/data/super-tags';

export const createTagBatchAction = guardedAction('superTags.print', tagBatchInput, async (user, data) => {
  const r = await createTagBatch(user.id, data);
  revalidatePath('/admin/supers/tags');
  return { ok: true, data: r };
});
