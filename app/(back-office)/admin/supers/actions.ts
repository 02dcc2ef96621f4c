'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/server-action';
import { tagBatchInput, voidPullInput } from '@/lib/schemas/supers';
import { createTagBatch } from '@/lib/data/supers/tags';
import { voidSuperPull } from '@/lib/data/supers/void';

export const createTagBatchAction = guardedAction('superTags.print', tagBatchInput, async (user, data) => {
  const r = await createTagBatch(user.id, data);
  revalidatePath('/admin/supers/tags');
  return { ok: true, data: r };
});

/** A pull, or a super still on the hive, recorded by mistake: voided with a reason (owner, or the keeper of the colony's yard). */
export const voidSuperPullAction = guardedAction('supers.write', voidPullInput, async (user, data) => {
  const r = await voidSuperPull(user, data.superPullId, data.reason, data.record);
  revalidatePath('/admin/supers');
  revalidatePath(`/admin/colonies/${r.colonyId}`);
  return { ok: true, data: r };
});
