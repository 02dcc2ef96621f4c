'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/server-action';
import { toGrams } from '@/lib/domain/units';
import {
  blendFormInput,
  containerInput,
  containerTypeInput,
  emptyWeightInput,
  lotDetailsInput,
  lotInput,
  pickSupersInput,
  readingInput,
  removeSuperInput,
  scanSuperInput,
  stageInput,
  voidInput,
  waxInput,
} from '@/lib/schemas/lots';
import { createLot, setCappingsWax, updateLotDetails } from '@/lib/data/lots/lots';
import {
  addSuperByTag,
  addSupersById,
  removeSuper,
  setSuperEmptyWeight,
  type AddedSuper,
} from '@/lib/data/lots/supers';
import { addContainer, addReading, voidRecord } from '@/lib/data/lots/records';
import { changeLotStage, type StageResult } from '@/lib/data/lots/stage';
import { createBlend } from '@/lib/data/lots/blends';
import { saveContainerType } from '@/lib/data/lots/container-types';

const touched = (lotId: number) => {
  revalidatePath('/admin/lots');
  revalidatePath(`/admin/lots/${lotId}`);
};

export const createLotAction = guardedAction('lots.write', lotInput, async (user, data) => {
  const lot = await createLot(user, data);
  revalidatePath('/admin/lots');
  return { ok: true, data: { id: lot.id, code: lot.code } };
});

export const updateLotAction = guardedAction('lots.write', lotDetailsInput, async (user, { lotId, ...data }) => {
  await updateLotDetails(user, lotId, data);
  touched(lotId);
  return { ok: true };
});

export const scanSuperAction = guardedAction(
  'lots.write',
  scanSuperInput,
  async (user, data): Promise<{ ok: true; data: AddedSuper }> => {
    const added = await addSuperByTag(user, data.lotId, data.tagCode, data.overrideReason || undefined);
    touched(data.lotId);
    return { ok: true, data: added };
  },
);

export const pickSupersAction = guardedAction('lots.write', pickSupersInput, async (user, data) => {
  const added = await addSupersById(user, data.lotId, data.superPullIds);
  touched(data.lotId);
  return { ok: true, data: added };
});

export const removeSuperAction = guardedAction('lots.write', removeSuperInput, async (user, data) => {
  await removeSuper(user, data.lotId, data.superPullId, data.reason);
  touched(data.lotId);
  return { ok: true };
});

export const emptyWeightAction = guardedAction('lots.write', emptyWeightInput, async (user, data) => {
  await setSuperEmptyWeight(user, data.lotId, data.superPullId, toGrams(data.empty, data.unit));
  touched(data.lotId);
  return { ok: true };
});

export const addContainerAction = guardedAction('lots.write', containerInput, async (user, data) => {
  await addContainer(user, data.lotId, {
    containerTypeId: data.containerTypeId ?? null,
    label: data.label,
    grossGrams: toGrams(data.gross, data.unit),
    tareGrams: toGrams(data.tare, data.unit),
  });
  touched(data.lotId);
  return { ok: true };
});

export const waxAction = guardedAction('lots.write', waxInput, async (user, data) => {
  await setCappingsWax(user, data.lotId, toGrams(data.wax, data.unit));
  touched(data.lotId);
  return { ok: true };
});

export const addReadingAction = guardedAction('lots.write', readingInput, async (user, data) => {
  const { lotId, ...reading } = data;
  const saved = await addReading(
    user,
    lotId,
    reading.method === 'ri'
      ? {
          method: 'ri',
          refractiveIndex: reading.refractiveIndex,
          temperatureC: reading.temperatureC,
          takenOn: reading.takenOn,
        }
      : {
          method: 'scale',
          scaleWaterPct: reading.scaleWaterPct,
          temperatureC: reading.temperatureC,
          takenOn: reading.takenOn,
        },
  );
  touched(lotId);
  return { ok: true, data: saved };
});

export const voidRecordAction = guardedAction('lots.write', voidInput, async (user, data) => {
  await voidRecord(user, data.lotId, data.kind, data.recordId, data.reason);
  touched(data.lotId);
  return { ok: true };
});

export const changeStageAction = guardedAction(
  'lots.write',
  stageInput,
  async (user, data): Promise<{ ok: true; data: StageResult }> => {
    const result = await changeLotStage(user, data.lotId, data.target, data.reason, data.extractedOn);
    touched(data.lotId);
    return { ok: true, data: result };
  },
);

export const createBlendAction = guardedAction('lots.write', blendFormInput, async (user, data) => {
  const blend = await createBlend(user, {
    floralSource: data.floralSource,
    notes: data.notes,
    parts: data.parts.map((p) => ({ lotId: p.lotId, grams: toGrams(p.amount, data.unit) })),
  });
  revalidatePath('/admin/lots');
  return { ok: true, data: blend };
});

export const saveContainerTypeAction = guardedAction(
  'containerTypes.manage',
  containerTypeInput,
  async (user, data) => {
    const id = await saveContainerType(user, {
      id: data.id,
      name: data.name,
      usualTareGrams: toGrams(data.usualTare, data.unit),
      active: data.active,
    });
    revalidatePath('/admin/lots/container-types');
    return { ok: true, data: { id } };
  },
);

export type LotActions = {
  update: typeof updateLotAction;
  scan: typeof scanSuperAction;
  pick: typeof pickSupersAction;
  remove: typeof removeSuperAction;
  empty: typeof emptyWeightAction;
  container: typeof addContainerAction;
  wax: typeof waxAction;
  reading: typeof addReadingAction;
  void: typeof voidRecordAction;
  stage: typeof changeStageAction;
};
