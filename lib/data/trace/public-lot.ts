import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { getSettings } from '@/lib/data/settings/settings';

export type PublicLot = {
  code: string;
  floralSource: string;
  isBlend: boolean;
  harvestMonths: string[]; // 'YYYY-MM', sorted
  extractedOn: string | null;
  region: string;
  yardNames: string[];
  waterPct: number | null;
  /** True when a blend has no readings of its own and waterPct is its parents' means, weighted by grams. */
  waterFromParents: boolean;
  bestBeforeOn: string | null;
  note: string;
  businessName: string;
};

const MAX_DEPTH = 10;

function meanWater(readings: { waterPct: number }[]): number | null {
  return readings.length ? readings.reduce((s, r) => s + Number(r.waterPct), 0) / readings.length : null;
}

/** A blend without readings of its own: its parents' mean water, weighted by the grams each gave. */
async function blendWater(lotId: number): Promise<number | null> {
  const { LotParent, MoistureReading } = getDb().models;
  const links = await LotParent.findAll({ where: { childLotId: lotId } });
  let grams = 0;
  let sum = 0;
  for (const link of links) {
    const mean = meanWater(
      await MoistureReading.findAll({ where: { lotId: link.parentLotId, voidedAt: null }, attributes: ['waterPct'] }),
    );
    if (mean === null) return null; // one unmeasured part: no honest figure for the whole
    grams += link.grams;
    sum += mean * link.grams;
  }
  return grams > 0 ? sum / grams : null;
}

/** The lot and every lot blended into it (parents of parents too), guarding against cycles. */
async function lotTreeIds(rootId: number): Promise<number[]> {
  const { LotParent } = getDb().models;
  const seen = new Set<number>([rootId]);
  let frontier = [rootId];
  for (let depth = 0; depth < MAX_DEPTH && frontier.length > 0; depth++) {
    const links = await LotParent.findAll({
      where: { childLotId: { [Op.in]: frontier } },
      attributes: ['parentLotId'],
    });
    frontier = links.map((l) => l.parentLotId).filter((id) => !seen.has(id));
    frontier.forEach((id) => seen.add(id));
  }
  return [...seen];
}

/**
 * What a customer may see about a lot from the QR code on a jar: no coordinates, no people,
 * no weights. Only lots that reached the shelf (released, packed out, or jarred before a hold).
 */
export async function getPublicLot(code: string): Promise<PublicLot | null> {
  const { Lot, SuperPull, Colony, Yard, MoistureReading, JarringRun } = getDb().models;
  if (!/^[A-Za-z0-9!"%&'()*+,\-./:;<=>?_]{1,20}$/.test(code)) return null;
  const lot = await Lot.findOne({ where: { code } });
  if (!lot) return null;
  const shelved =
    lot.stage === 'released' ||
    lot.stage === 'packed_out' ||
    (await JarringRun.count({ where: { lotId: lot.id } })) > 0;
  if (!shelved) return null;

  const ids = await lotTreeIds(lot.id);
  const [pulls, readings, settings] = await Promise.all([
    SuperPull.findAll({
      where: { lotId: { [Op.in]: ids } },
      attributes: ['pulledOn'],
      include: [
        {
          model: Colony,
          as: 'colony',
          attributes: ['id'],
          include: [{ model: Yard, as: 'yard', attributes: ['name'] }],
        },
      ],
    }),
    MoistureReading.findAll({ where: { lotId: lot.id, voidedAt: null }, attributes: ['waterPct'] }),
    getSettings(),
  ]);
  const months = [...new Set(pulls.map((p) => p.pulledOn?.slice(0, 7)).filter((m): m is string => !!m))].sort();
  const yards = [...new Set(pulls.map((p) => p.colony?.yard?.name).filter((n): n is string => !!n))].sort();
  let water = meanWater(readings);
  let waterFromParents = false;
  if (water === null && lot.isBlend) {
    water = await blendWater(lot.id);
    waterFromParents = water !== null;
  }
  return {
    code: lot.code,
    floralSource: lot.floralSource,
    isBlend: lot.isBlend,
    harvestMonths: months,
    extractedOn: lot.extractedOn ?? null,
    region: settings.region,
    yardNames: yards,
    waterPct: water === null ? null : Math.round(water * 10) / 10,
    waterFromParents,
    bestBeforeOn: lot.bestBeforeOn ?? null,
    note: settings.publicLotNote,
    businessName: settings.businessName,
  };
}
