import 'server-only';
import { UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { Colony, ColonyOrigin, ColonyStatus } from '@/models/colony';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { recordAudit } from '@/lib/data/audit';
import { canWriteColonies, colonyInScope, inScope, yardScope } from '@/lib/data/yards/scope';

/** A colony the user may write, or a 404 (never 403: another keeper's colony is not shown to exist). */
export async function writableColony(
  user: SessionUser,
  colonyId: number,
  transaction?: Parameters<typeof colonyInScope>[2],
): Promise<Colony> {
  const colony = canWriteColonies(user) ? await colonyInScope(user, colonyId, transaction) : null;
  if (!colony) throw new NotFoundError('No such colony.');
  return colony;
}

async function keeperFor(user: SessionUser, yardId: number, requested: number | undefined): Promise<number> {
  const { models } = getDb();
  if (user.role === 'keeper') return user.id; // a keeper records colonies as their own
  const keeperId = requested ?? user.id;
  const assigned = await models.YardKeeper.findOne({ where: { yardId, userId: keeperId } });
  const person = await models.User.findByPk(keeperId);
  if (!person || (person.role !== 'owner' && !assigned))
    throw new InvalidError('The keeper must be assigned to this yard first.');
  return keeperId;
}

type ColonyData = {
  code: string;
  yardId: number;
  keeperId?: number;
  origin: ColonyOrigin;
  parentColonyId: number | null;
  queenYear: number | null;
  startedOn: string | null;
  notes: string;
};

function uniqueCode<T>(p: Promise<T>, code: string): Promise<T> {
  return p.catch((err) => {
    if (err instanceof UniqueConstraintError) throw new ConflictError(`Colony code ${code} is already used.`);
    throw err;
  });
}

export async function createColony(user: SessionUser, data: ColonyData): Promise<number> {
  const { sequelize, models } = getDb();
  if (!canWriteColonies(user) || !inScope(await yardScope(user), data.yardId)) throw new NotFoundError('No such yard.');
  if (data.origin === 'split' && !data.parentColonyId)
    throw new InvalidError('A split needs the colony it was split from.');
  if (data.parentColonyId && !(await colonyInScope(user, data.parentColonyId)))
    throw new NotFoundError('No such parent colony.');
  const keeperId = await keeperFor(user, data.yardId, data.keeperId);
  return uniqueCode(
    sequelize.transaction(async (t) => {
      const colony = await models.Colony.create(
        { ...data, keeperId, parentColonyId: data.origin === 'split' ? data.parentColonyId : null },
        { transaction: t },
      );
      await recordAudit(
        {
          actorUserId: user.id,
          action: 'colony.create',
          entityType: 'colony',
          entityId: colony.id,
          after: colony.get({ plain: true }),
        },
        t,
      );
      return colony.id;
    }),
    data.code,
  );
}

export async function updateColony(
  user: SessionUser,
  colonyId: number,
  data: Omit<ColonyData, 'yardId'>,
): Promise<void> {
  const { sequelize } = getDb();
  await uniqueCode(
    sequelize.transaction(async (t) => {
      const colony = await writableColony(user, colonyId, t);
      if (data.parentColonyId === colonyId) throw new InvalidError('A colony cannot be its own parent.');
      if (data.origin === 'split' && !data.parentColonyId)
        throw new InvalidError('A split needs the colony it was split from.');
      if (data.parentColonyId && !(await colonyInScope(user, data.parentColonyId, t)))
        throw new NotFoundError('No such parent colony.');
      const keeperId =
        user.role === 'keeper'
          ? colony.keeperId
          : await keeperFor(user, colony.yardId, data.keeperId ?? colony.keeperId);
      const before = colony.get({ plain: true });
      await colony.update(
        { ...data, keeperId, parentColonyId: data.origin === 'split' ? data.parentColonyId : null },
        { transaction: t },
      );
      await recordAudit(
        {
          actorUserId: user.id,
          action: 'colony.update',
          entityType: 'colony',
          entityId: colony.id,
          before,
          after: colony.get({ plain: true }),
        },
        t,
      );
    }),
    data.code,
  );
}

/** Moves keep the colony's history: only the yard changes, and a move event records from and to. */
export async function moveColony(
  user: SessionUser,
  input: { colonyId: number; yardId: number; occurredOn: string; note: string },
): Promise<void> {
  const { sequelize, models } = getDb();
  await sequelize.transaction(async (t) => {
    const colony = await writableColony(user, input.colonyId, t);
    if (!inScope(await yardScope(user, t), input.yardId)) throw new NotFoundError('No such yard.');
    if (colony.yardId === input.yardId) throw new InvalidError('The colony is already in that yard.');
    const from = await models.Yard.findByPk(colony.yardId, { transaction: t });
    const to = await models.Yard.findByPk(input.yardId, { transaction: t });
    if (!to) throw new NotFoundError('No such yard.');
    await colony.update({ yardId: input.yardId }, { transaction: t });
    await models.ColonyEvent.create(
      {
        colonyId: colony.id,
        kind: 'move',
        occurredOn: input.occurredOn,
        details: { fromYardId: from?.id, fromYard: from?.name, toYardId: to.id, toYard: to.name },
        note: input.note,
        recordedBy: user.id,
      },
      { transaction: t },
    );
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'colony.move',
        entityType: 'colony',
        entityId: colony.id,
        before: { yardId: from?.id },
        after: { yardId: to.id },
      },
      t,
    );
  });
}

export async function setColonyStatus(
  user: SessionUser,
  input: { colonyId: number; status: ColonyStatus; combinedIntoCode?: string; occurredOn: string; note: string },
): Promise<void> {
  const { sequelize, models } = getDb();
  await sequelize.transaction(async (t) => {
    const colony = await writableColony(user, input.colonyId, t);
    let combinedIntoId: number | null = null;
    if (input.status === 'combined') {
      const target = input.combinedIntoCode
        ? await models.Colony.findOne({ where: { code: input.combinedIntoCode }, transaction: t })
        : null;
      if (!target || !inScope(await yardScope(user, t), target.yardId))
        throw new NotFoundError('Name the colony it was combined into (one of your colonies).');
      if (target.id === colony.id) throw new InvalidError('A colony cannot be combined into itself.');
      combinedIntoId = target.id;
    }
    const before = { status: colony.status, combinedIntoId: colony.combinedIntoId };
    await colony.update({ status: input.status, combinedIntoId }, { transaction: t });
    await models.ColonyEvent.create(
      {
        colonyId: colony.id,
        kind: 'status',
        occurredOn: input.occurredOn,
        details: {
          from: before.status,
          to: input.status,
          combinedIntoId,
          combinedInto: input.status === 'combined' ? input.combinedIntoCode : undefined,
        },
        note: input.note,
        recordedBy: user.id,
      },
      { transaction: t },
    );
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'colony.status',
        entityType: 'colony',
        entityId: colony.id,
        before,
        after: { status: input.status, combinedIntoId },
      },
      t,
    );
  });
}

/** A split makes the new colony (origin split, parent link) and a split event on the parent. Idempotent by key. */
export async function splitColony(
  user: SessionUser,
  input: {
    colonyId: number;
    newCode: string;
    occurredOn: string;
    queenYear: number | null;
    note: string;
    idempotencyKey: string;
  },
): Promise<number> {
  const { sequelize, models } = getDb();
  const done = await models.ColonyEvent.findOne({ where: { idempotencyKey: input.idempotencyKey } });
  if (done) return Number(done.details.childId);
  return uniqueCode(
    sequelize.transaction(async (t) => {
      const parent = await writableColony(user, input.colonyId, t);
      const child = await models.Colony.create(
        {
          code: input.newCode,
          yardId: parent.yardId,
          keeperId: parent.keeperId,
          origin: 'split',
          parentColonyId: parent.id,
          queenYear: input.queenYear,
          startedOn: input.occurredOn,
          notes: '',
        },
        { transaction: t },
      );
      await models.ColonyEvent.create(
        {
          colonyId: parent.id,
          kind: 'split',
          occurredOn: input.occurredOn,
          details: { childId: child.id, childCode: child.code },
          note: input.note,
          recordedBy: user.id,
          idempotencyKey: input.idempotencyKey,
        },
        { transaction: t },
      );
      await recordAudit(
        {
          actorUserId: user.id,
          action: 'colony.split',
          entityType: 'colony',
          entityId: parent.id,
          after: { childId: child.id, childCode: child.code },
        },
        t,
      );
      return child.id;
    }),
    input.newCode,
  );
}

export async function addColonyNote(
  user: SessionUser,
  input: { colonyId: number; occurredOn: string; note: string; idempotencyKey: string },
): Promise<void> {
  const { models } = getDb();
  const colony = await writableColony(user, input.colonyId);
  await models.ColonyEvent.findOrCreate({
    where: { idempotencyKey: input.idempotencyKey },
    defaults: {
      colonyId: colony.id,
      kind: 'note',
      occurredOn: input.occurredOn,
      note: input.note,
      recordedBy: user.id,
      idempotencyKey: input.idempotencyKey,
    },
  });
}
