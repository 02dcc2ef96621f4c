'use server';
import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { guardedAction } from '@/lib/http/server-action';
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

const touched = (colonyId: number) => {
  revalidatePath(`/admin/colonies/${colonyId}`);
  revalidatePath('/admin/supers');
};

export const createColonyAction = guardedAction('colonies.write', colonyInput, async (user, data) => {
  const id = await createColony(user, data);
  revalidatePath(`/admin/yards/${data.yardId}`);
  return { ok: true, data: { id } };
});

export const updateColonyAction = guardedAction(
  'colonies.write',
  colonyUpdateInput,
  async (user, { colonyId, ...data }) => {
    await updateColony(user, colonyId, data);
    touched(colonyId);
    return { ok: true, data: { id: colonyId } };
  },
);

export const moveColonyAction = guardedAction('colonies.write', moveInput, async (user, data) => {
  await moveColony(user, data);
  touched(data.colonyId);
  return { ok: true };
});

export const colonyStatusAction = guardedAction('colonies.write', statusInput, async (user, data) => {
  await setColonyStatus(user, data);
  touched(data.colonyId);
  return { ok: true };
});

export const splitColonyAction = guardedAction('colonies.write', splitInput, async (user, data) => {
  const id = await splitColony(user, data);
  touched(data.colonyId);
  return { ok: true, data: { id } };
});

export const colonyNoteAction = guardedAction('colonies.write', noteInput, async (user, data) => {
  await addColonyNote(user, data);
  touched(data.colonyId);
  return { ok: true };
});

export const addFeedingAction = guardedAction('colonies.write', feedingInput, async (user, data) => {
  const r = await addFeeding(user, data);
  touched(data.colonyId);
  return { ok: true, data: r };
});

export const endFeedingAction = guardedAction(
  'colonies.write',
  feedingEndInput.extend({ colonyId: z.number().int() }),
  async (user, data) => {
    const r = await endFeeding(user, data.feedingId, data.endedOn);
    touched(data.colonyId);
    return { ok: true, data: r };
  },
);

export const addTreatmentAction = guardedAction('colonies.write', treatmentInput, async (user, data) => {
  const r = await addTreatment(user, data);
  touched(data.colonyId);
  return { ok: true, data: r };
});

export const endTreatmentAction = guardedAction(
  'colonies.write',
  treatmentEndInput.extend({ colonyId: z.number().int() }),
  async (user, data) => {
    const r = await endTreatment(user, data.treatmentId, data.removedOn);
    touched(data.colonyId);
    return { ok: true, data: r };
  },
);

export const superOnAction = guardedAction('supers.write', superOnInput, async (user, data) => {
  const id = await putSuperOn(user, data);
  touched(data.colonyId);
  return { ok: true, data: { id } };
});
