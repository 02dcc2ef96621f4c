import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { canReadLot, readableLotIds } from '@/lib/data/lots/access';
import { fillCheckReasons, namedFillChecks, type NamedFillCheck } from '@/lib/domain/fill-check';
import { jarsLotCanFill } from '@/lib/domain/jars';
import type { FillRuleSet } from '@/models/jarring-run';
import { getSettings } from '@/lib/data/settings/settings';
import type { SessionUser } from '@/lib/auth/session';
import type { JarringRunListQuery } from '@/lib/schemas/jarring';
import type { Page } from '@/lib/schemas/list-query';

/** What the jarring pages read: lots that can still be jarred, and runs already made. */

export type JarrableLot = {
  id: number;
  code: string;
  floralSource: string;
  extractedOn: string | null;
  netGrams: number;
  usedGrams: number;
  remainingGrams: number;
  jars: { productId: number; productName: string; jars: number }[];
};

/** Released lots with what they can still fill, per active product (after the owner's expected loss). */
export async function listJarrableLots(): Promise<JarrableLot[]> {
  const { Lot, Product } = getDb().models;
  const settings = await getSettings();
  const [lots, products] = await Promise.all([
    Lot.findAll({
      where: { stage: 'released' },
      order: [
        ['extractedOn', 'ASC'],
        ['code', 'ASC'],
      ],
    }),
    Product.findAll({
      where: { active: true },
      order: [
        ['sortOrder', 'ASC'],
        ['name', 'ASC'],
      ],
    }),
  ]);
  return lots.map((l) => {
    const remainingGrams = Math.max(0, l.netGrams - l.usedGrams);
    return {
      id: l.id,
      code: l.code,
      floralSource: l.floralSource,
      extractedOn: l.extractedOn ?? null,
      netGrams: l.netGrams,
      usedGrams: l.usedGrams,
      remainingGrams,
      jars: products.map((p) => ({
        productId: p.id,
        productName: p.name,
        jars: jarsLotCanFill(remainingGrams, p.netGrams, Number(settings.expectedLossPct)),
      })),
    };
  });
}

export type RunRow = {
  id: number;
  runOn: string;
  lotId: number;
  lotCode: string;
  floralSource: string;
  productId: number;
  productName: string;
  jarCount: number;
  honeyUsedGrams: number;
  ruleSet: FillRuleSet;
  pass: boolean;
  reasons: string[];
  /** Each fill check by name with its one-line result (EU: reference test and producer's check). */
  checks: NamedFillCheck[];
  mean: number;
  samples: number[];
  overrideReason: string | null;
  stocked: boolean;
  byName: string | null;
};

type RunModel = InstanceType<ReturnType<typeof getDb>['models']['JarringRun']> & { createdByUser?: { name: string } };
function toRunRow(r: RunModel): RunRow {
  const checks = r.fillReport?.reasons ? namedFillChecks(r.ruleSet, r.fillReport) : [];
  return {
    id: r.id,
    runOn: r.runOn,
    lotId: r.lotId,
    lotCode: r.lot?.code ?? '',
    floralSource: r.lot?.floralSource ?? '',
    productId: r.productId,
    productName: r.product?.name ?? '',
    jarCount: r.jarCount,
    honeyUsedGrams: r.honeyUsedGrams,
    ruleSet: r.ruleSet,
    pass: r.fillPass,
    reasons: fillCheckReasons(checks),
    checks,
    mean: r.fillReport?.mean ?? 0,
    samples: r.sampleGrams,
    overrideReason: r.overrideReason ?? null,
    stocked: r.fillPass || !!r.overrideReason,
    byName: null,
  };
}

/** One page of jarring runs (all, or one lot's) of the lots this user may read, newest first unless sorted otherwise. */
export async function listJarringRuns(user: SessionUser, query: JarringRunListQuery): Promise<Page<RunRow>> {
  const { JarringRun, Lot, Product } = getDb().models;
  const { page, pageSize } = query;
  const dir = query.dir === 'asc' ? 'ASC' : 'DESC';
  const readable = await readableLotIds(user);
  const lotIds = query.lotId ? [query.lotId].filter((id) => !readable || readable.includes(id)) : readable;
  const where = lotIds ? { lotId: { [Op.in]: lotIds } } : {};
  const [total, rows] = await Promise.all([
    JarringRun.count({ where }),
    JarringRun.findAll({
      where,
      include: [
        { model: Lot, as: 'lot', attributes: ['code', 'floralSource'] },
        { model: Product, as: 'product', attributes: ['name'] },
      ],
      order: [
        ['runOn', dir],
        ['id', dir],
      ],
      limit: pageSize,
      offset: (page - 1) * pageSize,
    }),
  ]);
  return { rows: rows.map(toRunRow), total, page, pageSize };
}

/** One jarring run, or null when there is none or its lot is not one this user may read (a 404 either way). */
export async function getJarringRun(user: SessionUser, id: number): Promise<RunRow | null> {
  const { JarringRun, Lot, Product, User } = getDb().models;
  const r = await JarringRun.findByPk(id, {
    include: [
      { model: Lot, as: 'lot', attributes: ['code', 'floralSource'] },
      { model: Product, as: 'product', attributes: ['name'] },
    ],
  });
  if (!r || !(await canReadLot(user, r.lotId))) return null;
  const row = toRunRow(r);
  if (r.createdBy) row.byName = (await User.findByPk(r.createdBy, { attributes: ['name'] }))?.name ?? null;
  return row;
}
