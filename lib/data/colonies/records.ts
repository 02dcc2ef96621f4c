import 'server-only';
import type { Model, ModelStatic, Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { FeedingKind } from '@/lib/domain/conflicts';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { recordAudit, type AuditInput } from '@/lib/data/audit';
import { writableColony } from './write';
import { recomputeColonyFlags } from '@/lib/data/supers/flags';

type Reflagged = { reflagged: number };

/**
 * One change of a colony's feedings or treatments, in one transaction: `change` checks that the colony is the user's
 * to write, writes, and says which colony and what to audit; the audit entry follows and the colony's pulled supers
 * are re-checked against the change.
 */
async function changeColonyRecord(
  user: SessionUser,
  change: (t: Transaction) => Promise<{ colonyId: number } & Pick<AuditInput, 'action' | 'before' | 'after'>>,
): Promise<Reflagged> {
  return getDb().sequelize.transaction(async (t) => {
    const { colonyId, ...audit } = await change(t);
    await recordAudit({ actorUserId: user.id, entityType: 'colony', entityId: colonyId, ...audit }, t);
    return { reflagged: await recomputeColonyFlags(colonyId, t) };
  });
}

/**
 * Ends an open feeding or treatment (`what`) on `on`, not before it began: its `start` and `end` name the
 * record's own date columns.
 */
async function endColonyRecord<Start extends string, End extends string>(
  user: SessionUser,
  model: ModelStatic<Model & { colonyId: number } & Record<Start, string> & Record<End, string | null>>,
  spec: { what: 'feeding' | 'treatment'; start: Start; end: End; early: string },
  id: number,
  on: string,
): Promise<Reflagged> {
  return changeColonyRecord(user, async (t) => {
    const row = await model.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!row) throw new NotFoundError(`No such ${spec.what}.`);
    await writableColony(user, row.colonyId, t);
    if (on < row[spec.start]) throw new InvalidError(spec.early);
    const before = { [spec.end]: row[spec.end] };
    await row.update({ [spec.end]: on }, { transaction: t });
    return {
      colonyId: row.colonyId,
      action: `${spec.what}.update`,
      before,
      after: { [`${spec.what}Id`]: id, [spec.end]: on },
    };
  });
}

/** Adds a feeding (idempotent by key) and re-checks the colony's pulled supers. */
export async function addFeeding(
  user: SessionUser,
  input: {
    colonyId: number;
    kind: FeedingKind;
    amount: string;
    startedOn: string;
    endedOn: string | null;
    note: string;
    idempotencyKey: string;
  },
): Promise<Reflagged> {
  const { models } = getDb();
  if (await models.Feeding.findOne({ where: { idempotencyKey: input.idempotencyKey } })) return { reflagged: 0 };
  return changeColonyRecord(user, async (t) => {
    const colony = await writableColony(user, input.colonyId, t);
    const row = await models.Feeding.create({ ...input, colonyId: colony.id, recordedBy: user.id }, { transaction: t });
    return { colonyId: colony.id, action: 'feeding.create', after: row.get({ plain: true }) };
  });
}

export function endFeeding(user: SessionUser, feedingId: number, endedOn: string): Promise<Reflagged> {
  const spec = {
    what: 'feeding',
    start: 'startedOn',
    end: 'endedOn',
    early: 'The feeding cannot end before it started.',
  } as const;
  return endColonyRecord(user, getDb().models.Feeding, spec, feedingId, endedOn);
}

/** Copies the kind's supers-allowed and waiting days onto the record, so later edits of the list do not rewrite history. */
export async function addTreatment(
  user: SessionUser,
  input: {
    colonyId: number;
    treatmentKindId: number;
    productName: string;
    appliedOn: string;
    removedOn: string | null;
    note: string;
    idempotencyKey: string;
  },
): Promise<Reflagged> {
  const { models } = getDb();
  if (await models.Treatment.findOne({ where: { idempotencyKey: input.idempotencyKey } })) return { reflagged: 0 };
  return changeColonyRecord(user, async (t) => {
    const colony = await writableColony(user, input.colonyId, t);
    const kind = await models.TreatmentKind.findByPk(input.treatmentKindId, { transaction: t });
    if (!kind || !kind.active) throw new InvalidError('Choose a treatment kind from the list.');
    const row = await models.Treatment.create(
      {
        ...input,
        colonyId: colony.id,
        supersAllowed: kind.supersAllowed,
        waitingDays: kind.waitingDays,
        recordedBy: user.id,
      },
      { transaction: t },
    );
    return { colonyId: colony.id, action: 'treatment.create', after: row.get({ plain: true }) };
  });
}

export function endTreatment(user: SessionUser, treatmentId: number, removedOn: string): Promise<Reflagged> {
  const spec = {
    what: 'treatment',
    start: 'appliedOn',
    end: 'removedOn',
    early: 'The treatment cannot be removed before it was applied.',
  } as const;
  return endColonyRecord(user, getDb().models.Treatment, spec, treatmentId, removedOn);
}

export type TreatmentKindRow = {
  id: number;
  name: string;
  supersAllowed: boolean;
  waitingDays: number;
  notes: string;
  active: boolean;
};

export async function listTreatmentKinds(activeOnly = false): Promise<TreatmentKindRow[]> {
  const rows = await getDb().models.TreatmentKind.findAll({
    where: activeOnly ? { active: true } : {},
    order: [['name', 'ASC']],
  });
  return rows.map(({ id, name, supersAllowed, waitingDays, notes, active }) => ({
    id,
    name,
    supersAllowed,
    waitingDays,
    notes,
    active,
  }));
}

/** Owner only. Existing treatments keep the values they were recorded with. */
export async function saveTreatmentKind(
  actorUserId: number,
  input: Omit<TreatmentKindRow, 'id'> & { id?: number },
): Promise<number> {
  const { sequelize, models } = getDb();
  const clash = await models.TreatmentKind.findOne({ where: { name: input.name } });
  if (clash && clash.id !== input.id) throw new ConflictError(`There is already a kind called ${input.name}.`);
  return sequelize.transaction(async (t) => {
    const { id, ...fields } = input;
    if (id) {
      const row = await models.TreatmentKind.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!row) throw new NotFoundError('No such treatment kind.');
      const before = row.get({ plain: true });
      await row.update(fields, { transaction: t });
      await recordAudit(
        {
          actorUserId,
          action: 'treatmentKind.update',
          entityType: 'treatmentKind',
          entityId: id,
          before,
          after: fields,
        },
        t,
      );
      return id;
    }
    const row = await models.TreatmentKind.create(fields, { transaction: t });
    await recordAudit(
      { actorUserId, action: 'treatmentKind.create', entityType: 'treatmentKind', entityId: row.id, after: fields },
      t,
    );
    return row.id;
  });
}
