import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { superConflicts, type FeedingRecord, type TreatmentRecord } from '@/lib/domain/conflicts';
import { flagReasons, pullWindow } from '@/lib/domain/pull-window';
import { getSettingsIn } from '@/lib/data/settings/settings';

export type ColonyRecords = {
  feedings: FeedingRecord[];
  treatments: TreatmentRecord[];
  pulledDates: { id: number; pulledOn: string }[];
  /** The owner's season start month: where a window with no earlier pull starts. */
  seasonStartMonth: number;
};

export async function colonyRecords(colonyId: number, t: Transaction): Promise<ColonyRecords> {
  const { models } = getDb();
  // One after another: a transaction is one connection, which runs one query at a time.
  const feedings = await models.Feeding.findAll({ where: { colonyId }, transaction: t });
  const treatments = await models.Treatment.findAll({
    where: { colonyId },
    include: [{ association: 'kind', attributes: ['name'] }],
    transaction: t,
  });
  // A voided pull was never there: it neither narrows nor widens its neighbours' windows.
  const pulls = await models.SuperPull.findAll({
    where: { colonyId, pulledOn: { [Op.ne]: null }, voidedAt: null },
    attributes: ['id', 'pulledOn'],
    transaction: t,
  });
  return {
    feedings: feedings.map((f) => ({ kind: f.kind, startedOn: f.startedOn, endedOn: f.endedOn ?? null })),
    // supers_allowed and waiting_days are the values copied onto the treatment when recorded.
    treatments: treatments.map((x) => ({
      kindName: x.kind?.name ?? 'Treatment',
      productName: x.productName,
      supersAllowed: x.supersAllowed,
      waitingDays: x.waitingDays,
      appliedOn: x.appliedOn,
      removedOn: x.removedOn ?? null,
    })),
    pulledDates: pulls.map((p) => ({ id: p.id, pulledOn: p.pulledOn as string })),
    seasonStartMonth: (await getSettingsIn(t)).seasonStartMonth,
  };
}

export function flagsWith(records: ColonyRecords, pull: { id?: number; pulledOn: string; putOnOn: string | null }) {
  const previous = records.pulledDates.filter((p) => p.id !== pull.id).map((p) => p.pulledOn);
  const window = pullWindow(pull.pulledOn, pull.putOnOn, previous, records.seasonStartMonth);
  const result = superConflicts(window, records);
  return { flagged: result.flagged, flagReasons: flagReasons(window, result.reasons) };
}

/** The conflict flag of a super about to be stored as pulled on this colony. */
export async function flagsForPull(
  colonyId: number,
  pull: { id?: number; pulledOn: string; putOnOn: string | null },
  t: Transaction,
) {
  return flagsWith(await colonyRecords(colonyId, t), pull);
}

/**
 * After a feeding or treatment is added or edited, or a pull is voided, every standing pulled super
 * of the colony is checked again: a record entered late must still flag the supers it touched.
 * A voided pull keeps the flag it had when it was voided. Returns how many changed.
 */
export async function recomputeColonyFlags(colonyId: number, t: Transaction): Promise<number> {
  const { models } = getDb();
  const records = await colonyRecords(colonyId, t);
  // Locked in id order, as everywhere else supers are locked, so two writers cannot deadlock.
  const pulls = await models.SuperPull.findAll({
    where: { colonyId, pulledOn: { [Op.ne]: null }, voidedAt: null },
    order: [['id', 'ASC']],
    transaction: t,
    lock: t.LOCK.UPDATE,
  });
  let changed = 0;
  for (const pull of pulls) {
    const next = flagsWith(records, { id: pull.id, pulledOn: pull.pulledOn as string, putOnOn: pull.putOnOn ?? null });
    if (next.flagged !== pull.flagged || JSON.stringify(next.flagReasons) !== JSON.stringify(pull.flagReasons)) {
      await pull.update(next, { transaction: t });
      changed++;
    }
  }
  return changed;
}
