import 'server-only';
import { cache } from 'react';
import type { InferAttributes, Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { BusinessSetting } from '@/models/business-setting';
import { recordAudit } from '@/lib/data/audit';
import { DEFAULT_SUPER_ESTIMATES } from '@/lib/domain/yield-allocation';

export type Settings = Omit<InferAttributes<BusinessSetting>, 'createdAt' | 'updatedAt'>;

const FALLBACK_NAME = 'Combtrace';

/** The business settings (one row). Cached per request. */
export const getSettings = cache(async (): Promise<Settings> => {
  const { BusinessSetting } = getDb().models;
  const row = await BusinessSetting.findByPk(1);
  if (row) {
    const { createdAt: _c, updatedAt: _u, ...rest } = row.get({ plain: true });
    // Depths the owner has not set fall back to the common-practice defaults.
    return { ...rest, superEstimates: { ...DEFAULT_SUPER_ESTIMATES, ...rest.superEstimates } };
  }
  const {
    createdAt: _c,
    updatedAt: _u,
    ...rest
  } = BusinessSetting.build({ id: 1, businessName: FALLBACK_NAME }).get({ plain: true });
  return rest;
});

/**
 * The settings read on the caller's transaction connection. Use this inside a transaction: the
 * pooled getSettings would take a second connection, and many concurrent transactions could then
 * wait on each other for the pool.
 */
export async function getSettingsIn(t: Transaction): Promise<Settings> {
  const row = await getDb().models.BusinessSetting.findByPk(1, { transaction: t });
  if (!row) return getSettings();
  const { createdAt: _c, updatedAt: _u, ...rest } = row.get({ plain: true });
  return { ...rest, superEstimates: { ...DEFAULT_SUPER_ESTIMATES, ...rest.superEstimates } };
}

export async function updateSettings(actorUserId: number, patch: Partial<Settings>): Promise<void> {
  const { sequelize, models } = getDb();
  await sequelize.transaction(async (t: Transaction) => {
    const row = await models.BusinessSetting.findByPk(1, { transaction: t, lock: t.LOCK.UPDATE });
    if (!row) {
      await models.BusinessSetting.create({ id: 1, businessName: FALLBACK_NAME, ...patch }, { transaction: t });
      return;
    }
    const before = row.get({ plain: true });
    const { id: _id, ...changes } = patch;
    await row.update(changes, { transaction: t });
    const changedKeys = Object.keys(changes) as (keyof typeof before)[];
    await recordAudit(
      {
        actorUserId,
        action: 'settings.update',
        entityType: 'settings',
        entityId: 1,
        before: Object.fromEntries(changedKeys.map((k) => [k, before[k]])),
        after: Object.fromEntries(changedKeys.map((k) => [k, row.get(k)])),
      },
      t,
    );
  });
}
