'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/server-action';
import { yardInput, yardUpdateInput } from '@/lib/schemas/yards';
import { pullBatch } from '@/lib/schemas/supers';
import { saveYard } from '@/lib/data/yards/yards';
import { recordPulls } from '@/lib/data/supers/record';

export const createYardAction = guardedAction('yards.manage', yardInput, async (user, data) => {
  const id = await saveYard(user.id, null, data);
  revalidatePath('/admin/yards');
  return { ok: true, data: { id } };
});

export const updateYardAction = guardedAction('yards.manage', yardUpdateInput, async (user, { yardId, ...data }) => {
  await saveYard(user.id, yardId, data);
  revalidatePath('/admin/yards');
  revalidatePath(`/admin/yards/${yardId}`);
  return { ok: true, data: { id: yardId } };
});

/** The keeper's pull pass: several colonies at once, each entry idempotent by its own key. */
export const recordPullsAction = guardedAction('supers.write', pullBatch, async (user, data) => {
  const results = await recordPulls(user, data.entries);
  for (const id of new Set(data.entries.map((e) => e.colonyId))) revalidatePath(`/admin/colonies/${id}`);
  revalidatePath('/admin/supers');
  return { ok: true, data: { results } };
});
