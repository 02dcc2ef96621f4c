import 'server-only';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { Model, Transaction } from 'sequelize';
import { supersAtRisk, type FeedingKind, type SupersAtRisk } from '@/lib/domain/conflicts';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { recordAudit } from '@/lib/data/audit';
import { writableColony } from './write';
import { recomputeColonyFlags } from '@/lib/data/supers/flags';

/**
 * What to do when the record would touch supers still on the hive: `ask` saves nothing and
 * returns the warning (the form then offers to take them off first or to mark them); `mark` saves
 * and flags those supers now. A sender that cannot ask (a queued entry, the API) gets `mark`: the
 * entry is never lost, never saved silently, and its result carries the warning.
 */
export type OnSupers = 'ask' | 'mark';
export type SuperWarning = NonNullable<SupersAtRisk>;
export type RecordResult = { saved: boolean; reflagged: number; warning: SuperWarning | null };

async function supersOnHive(colonyId: number, t: Transaction) {
  const rows = await getDb().models.SuperPull.findAll({
    where: { colonyId, pulledOn: null, voidedAt: null },
    order: [['id', 'ASC']],
    transaction: t,
    lock: t.LOCK.UPDATE,
  });
  return rows.map((r) => ({ id: r.id, tagCode: r.tagCode ?? null, depth: r.depth, putOnOn: r.putOnOn ?? null }));
}

/** Flags the supers still on the hive that the new record touches (a pull recomputes the same flag later). */
async function markSupers(warning: SuperWarning, t: Transaction): Promise<number> {
  const { models } = getDb();
  for (const s of warning.supers) {
    const row = await models.SuperPull.findByPk(s.id, { transaction: t });
    if (!row) continue;
    const reasons = row.flagReasons.includes(warning.reason) ? row.flagReasons : [...row.flagReasons, warning.reason];
    await row.update({ flagged: true, flagReasons: reasons }, { transaction: t });
  }
  return warning.supers.length;
}

/** What a new record touches, in the terms of `supersAtRisk`. */
type RecordTouch = Parameters<typeof supersAtRisk>[0];

/**
 * Adds one feeding or treatment (idempotent by its key) in one transaction: the colony must be the user's to write;
 * `prepare` may refuse the record and says what it touches and how to create it. Supers still on the hive that it
 * touches are handled by `onSupers` (see `OnSupers`); the audit entry names the supers marked, and the colony's
 * pulled supers are re-checked.
 */
async function addColonyRecord(
  user: SessionUser,
  input: { colonyId: number; idempotencyKey: string; onSupers?: OnSupers },
  record: {
    action: 'feeding.create' | 'treatment.create';
    existing: (idempotencyKey: string) => Promise<unknown>;
    prepare: (t: Transaction) => Promise<{ touches: RecordTouch; create: (colonyId: number) => Promise<Model> }>;
  },
): Promise<RecordResult> {
  const { onSupers = 'mark' } = input;
  if (await record.existing(input.idempotencyKey)) return { saved: true, reflagged: 0, warning: null };
  return getDb().sequelize.transaction(async (t) => {
    const colony = await writableColony(user, input.colonyId, t);
    const { touches, create } = await record.prepare(t);
    const warning = supersAtRisk(touches, await supersOnHive(colony.id, t));
    if (warning && onSupers === 'ask') return { saved: false, reflagged: 0, warning };
    const row = await create(colony.id);
    await recordAudit(
      {
        actorUserId: user.id,
        action: record.action,
        entityType: 'colony',
        entityId: colony.id,
        after: { ...row.get({ plain: true }), ...(warning ? { markedSupers: warning.supers.map((s) => s.id) } : {}) },
      },
      t,
    );
    const marked = warning ? await markSupers(warning, t) : 0;
    return { saved: true, reflagged: marked + (await recomputeColonyFlags(colony.id, t)), warning };
  });
}

/**
 * Adds a feeding (idempotent by key) and re-checks the colony's pulled supers. Sugar fed while
 * supers are on the hive is caught now, not at the pull: see `OnSupers`.
 */
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
    onSupers?: OnSupers;
  },
): Promise<RecordResult> {
  const { Feeding } = getDb().models;
  const { onSupers: _onSupers, ...fields } = input;
  return addColonyRecord(user, input, {
    action: 'feeding.create',
    existing: (idempotencyKey) => Feeding.findOne({ where: { idempotencyKey } }),
    prepare: async (t) => ({
      touches: { feeding: { kind: input.kind, startedOn: input.startedOn, endedOn: input.endedOn } },
      create: (colonyId) => Feeding.create({ ...fields, colonyId, recordedBy: user.id }, { transaction: t }),
    }),
  });
}

export async function endFeeding(
  user: SessionUser,
  feedingId: number,
  endedOn: string,
): Promise<{ reflagged: number }> {
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (t) => {
    const row = await models.Feeding.findByPk(feedingId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!row) throw new NotFoundError('No such feeding.');
    await writableColony(user, row.colonyId, t);
    if (endedOn < row.startedOn) throw new InvalidError('The feeding cannot end before it started.');
    const before = { endedOn: row.endedOn };
    await row.update({ endedOn }, { transaction: t });
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'feeding.update',
        entityType: 'colony',
        entityId: row.colonyId,
        before,
        after: { feedingId, endedOn },
      },
      t,
    );
    return { reflagged: await recomputeColonyFlags(row.colonyId, t) };
  });
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
    onSupers?: OnSupers;
  },
): Promise<RecordResult> {
  const { Treatment, TreatmentKind } = getDb().models;
  const { onSupers: _onSupers, ...fields } = input;
  return addColonyRecord(user, input, {
    action: 'treatment.create',
    existing: (idempotencyKey) => Treatment.findOne({ where: { idempotencyKey } }),
    prepare: async (t) => {
      const kind = await TreatmentKind.findByPk(input.treatmentKindId, { transaction: t });
      if (!kind || !kind.active) throw new InvalidError('Choose a treatment kind from the list.');
      const { supersAllowed, waitingDays } = kind;
      return {
        // A label that forbids supers needs the keeper's confirmation while supers are on the hive.
        touches: {
          treatment: {
            kindName: kind.name,
            productName: input.productName,
            supersAllowed,
            waitingDays,
            appliedOn: input.appliedOn,
            removedOn: input.removedOn,
          },
        },
        create: (colonyId) =>
          Treatment.create(
            { ...fields, colonyId, supersAllowed, waitingDays, recordedBy: user.id },
            { transaction: t },
          ),
      };
    },
  });
}

export async function endTreatment(
  user: SessionUser,
  treatmentId: number,
  removedOn: string,
): Promise<{ reflagged: number }> {
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (t) => {
    const row = await models.Treatment.findByPk(treatmentId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!row) throw new NotFoundError('No such treatment.');
    await writableColony(user, row.colonyId, t);
    if (removedOn < row.appliedOn) throw new InvalidError('The treatment cannot be removed before it was applied.');
    const before = { removedOn: row.removedOn };
    await row.update({ removedOn }, { transaction: t });
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'treatment.update',
        entityType: 'colony',
        entityId: row.colonyId,
        before,
        after: { treatmentId, removedOn },
      },
      t,
    );
    return { reflagged: await recomputeColonyFlags(row.colonyId, t) };
  });
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
