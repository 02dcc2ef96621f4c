'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/server-action';
import { treatmentKindInput } from '@/lib/schemas/treatment-kinds';
import { saveTreatmentKind } from '@/lib/data/colonies/records';

export const saveTreatmentKindAction = guardedAction(
  'treatmentKinds.manage',
  treatmentKindInput,
  async (user, data) => {
    const id = await saveTreatmentKind(user.id, data);
    revalidatePath('/admin/treatment-kinds');
    return { ok: true, data: { id } };
  },
);
