import 'server-only';
import { UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import { ConflictError, NotFoundError } from '@/lib/domain/errors';
import { recordAudit } from '@/lib/data/audit';

export type ContainerTypeRow = { id: number; name: string; usualTareGrams: number; active: boolean };

export async function listContainerTypes(includeInactive = false): Promise<ContainerTypeRow[]> {
  const rows = await getDb().models.ContainerType.findAll({
    where: includeInactive ? {} : { active: true },
    order: [['name', 'ASC']],
  });
  return rows.map((r) => ({ id: r.id, name: r.name, usualTareGrams: r.usualTareGrams, active: r.active }));
}

/** Owner-editable list of bucket, pail, drum and tank kinds with their usual tare. */
export async function saveContainerType(
  actor: SessionUser,
  input: { id?: number; name: string; usualTareGrams: number; active: boolean },
): Promise<number> {
  const { sequelize, models } = getDb();
  try {
    return await sequelize.transaction(async (t) => {
      if (input.id) {
        const row = await models.ContainerType.findByPk(input.id, { lock: t.LOCK.UPDATE, transaction: t });
        if (!row) throw new NotFoundError('No container type with that id.');
        const before = { name: row.name, usualTareGrams: row.usualTareGrams, active: row.active };
        await row.update(
          { name: input.name, usualTareGrams: input.usualTareGrams, active: input.active },
          { transaction: t },
        );
        await recordAudit(
          {
            actorUserId: actor.id,
            action: 'container_type.update',
            entityType: 'container_type',
            entityId: row.id,
            before,
            after: input,
          },
          t,
        );
        return row.id;
      }
      const row = await models.ContainerType.create(
        { name: input.name, usualTareGrams: input.usualTareGrams, active: input.active },
        { transaction: t },
      );
      await recordAudit(
        {
          actorUserId: actor.id,
          action: 'container_type.create',
          entityType: 'container_type',
          entityId: row.id,
          after: input,
        },
        t,
      );
      return row.id;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError)
      throw new ConflictError(`There is already a container type called ${input.name}.`);
    throw err;
  }
}
