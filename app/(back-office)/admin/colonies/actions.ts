'use server';
import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { guardedAction } from '@/lib/http/server-action';
import type { SessionUser } from '@/lib/auth/session';
import type { Permission } from '@/lib/auth/roles';
import type { ActionResult } from '@/lib/schemas/result';
import {
  colonyInput,
  colonyUpdateInput,
  moveInput,
  statusInput,
  splitInput,
  noteInput,
  feedingInput,
  feedingEndInput,
  treatmentInput,
  treatmentEndInput,
} from '@/lib/schemas/colonies';
import { superOnInput } from '@/lib/schemas/supers';
import {
  addColonyNote,
  createColony,
  moveColony,
  setColonyStatus,
  splitColony,
  updateColony,
} from '@/lib/data/colonies/write';
import { addFeeding, addTreatment, endFeeding, endTreatment } from '@/lib/data/colonies/records';
import { putSuperOn } from '@/lib/data/supers/record';

/**
 * A write to one colony (by default under colonies.write): `write` changes it and returns the result's data, none
 * when it returns nothing; then the colony's page and the super list are refreshed.
 */
function colonyAction<S extends z.ZodType<{ colonyId: number }>, R>(
  schema: S,
  write: (user: SessionUser, data: z.output<S>) => Promise<R>,
  permission: Permission = 'colonies.write',
) {
  type Data = R extends void ? undefined : R;
  return guardedAction<S, Data>(permission, schema, async (user, data) => {
    const result = await write(user, data);
    revalidatePath(`/admin/colonies/${data.colonyId}`);
    revalidatePath('/admin/supers');
    return (result === undefined ? { ok: true } : { ok: true, data: result }) as ActionResult<Data>;
  });
}

export const createColonyAction = guardedAction('colonies.write', colonyInput, async (user, data) => {
  const id = await createColony(user, data);
  revalidatePath(`/admin/yards/${data.yardId}`);
  return { ok: true, data: { id } };
});

export const updateColonyAction = colonyAction(colonyUpdateInput, async (user, { colonyId, ...data }) => {
  await updateColony(user, colonyId, data);
  return { id: colonyId };
});
export const moveColonyAction = colonyAction(moveInput, moveColony);
export const colonyStatusAction = colonyAction(statusInput, setColonyStatus);
export const splitColonyAction = colonyAction(splitInput, async (user, data) => ({
  id: await splitColony(user, data),
}));
export const colonyNoteAction = colonyAction(noteInput, addColonyNote);

export const addFeedingAction = colonyAction(feedingInput, addFeeding);
export const endFeedingAction = colonyAction(feedingEndInput.extend({ colonyId: z.number().int() }), (user, data) =>
  endFeeding(user, data.feedingId, data.endedOn),
);
export const addTreatmentAction = colonyAction(treatmentInput, addTreatment);
export const endTreatmentAction = colonyAction(treatmentEndInput.extend({ colonyId: z.number().int() }), (user, data) =>
  endTreatment(user, data.treatmentId, data.removedOn),
);

export const superOnAction = colonyAction(
  superOnInput,
  async (user, data) => ({ id: await putSuperOn(user, data) }),
  'supers.write',
);
