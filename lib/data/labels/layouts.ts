import 'server-only';
import { UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { BUILT_IN_LAYOUTS, validateLayout, type LabelLayout } from '@/lib/domain/label-layout';
import { recordAudit } from '@/lib/data/audit';

/** A layout to choose from: built-ins have keys b0…, saved ones s<id>. */
export type LayoutOption = { key: string; id: number | null; builtIn: boolean; layout: LabelLayout };

export async function listLabelLayouts(): Promise<LayoutOption[]> {
  const saved = await getDb().models.LabelLayoutRecord.findAll({ order: [['name', 'ASC']] });
  return [
    ...saved.map((r) => ({ key: `s${r.id}`, id: r.id, builtIn: false, layout: { ...r.layout, name: r.name } })),
    ...BUILT_IN_LAYOUTS.map((layout, i) => ({ key: `b${i}`, id: null, builtIn: true, layout })),
  ];
}

export async function getLabelLayout(key: string | null | undefined): Promise<LabelLayout> {
  const all = await listLabelLayouts();
  const hit = all.find((o) => o.key === key) ?? all.find((o) => o.builtIn);
  if (!hit) throw new NotFoundError('No such label layout.');
  return hit.layout;
}

/** Saves a named layout after checking it fits its paper. */
export async function saveLabelLayout(
  actorUserId: number,
  input: LabelLayout & { layoutId?: number },
): Promise<{ id: number }> {
  const { layoutId, ...layout } = input;
  const errors = validateLayout(layout);
  if (errors.length > 0) throw new InvalidError(errors.join(' '));
  if (BUILT_IN_LAYOUTS.some((b) => b.name === layout.name))
    throw new ConflictError('That name belongs to a built-in layout; choose another.');
  const { sequelize, models } = getDb();
  try {
    return await sequelize.transaction(async (t) => {
      if (layoutId) {
        const row = await models.LabelLayoutRecord.findByPk(layoutId, { transaction: t, lock: t.LOCK.UPDATE });
        if (!row) throw new NotFoundError('No such label layout.');
        const before = row.layout;
        await row.update({ name: layout.name, layout }, { transaction: t });
        await recordAudit(
          {
            actorUserId,
            action: 'labelLayout.update',
            entityType: 'label_layout',
            entityId: row.id,
            before,
            after: layout,
          },
          t,
        );
        return { id: row.id };
      }
      const row = await models.LabelLayoutRecord.create({ name: layout.name, layout }, { transaction: t });
      await recordAudit(
        { actorUserId, action: 'labelLayout.create', entityType: 'label_layout', entityId: row.id, after: layout },
        t,
      );
      return { id: row.id };
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw new ConflictError('A layout with that name exists already.');
    throw err;
  }
}

export async function deleteLabelLayout(actorUserId: number, id: number): Promise<void> {
  const { sequelize, models } = getDb();
  await sequelize.transaction(async (t) => {
    const row = await models.LabelLayoutRecord.findByPk(id, { transaction: t });
    if (!row) throw new NotFoundError('No such label layout.');
    await recordAudit(
      { actorUserId, action: 'labelLayout.delete', entityType: 'label_layout', entityId: id, before: row.layout },
      t,
    );
    await row.destroy({ transaction: t });
  });
}
