import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { signInAs } from '@/tests/support/session';
import PublicLotPage from '@/app/(storefront)/lot/[code]/page';
import { getPublicLot } from '@/lib/data/trace/public-lot';
import { releasedLot } from '@/tests/support/jarring-fixtures';

afterAll(closeDb);

async function pullsInto(lotId: number, yardName: string, pulledOn: string[]) {
  const { Yard, Colony, SuperPull, User } = getDb().models;
  const keeper = await User.findOne({ where: { role: 'keeper' } });
  const yard = await Yard.create({
    name: `${yardName} ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 5)}`,
    latitude: 51.123456,
    longitude: -1.654321,
  });
  const colony = await Colony.create({
    code: `TJC-${Math.random().toString(36).slice(2, 8)}`,
    yardId: yard.id,
    keeperId: keeper!.id,
    origin: 'nucleus',
  });
  for (const day of pulledOn)
    await SuperPull.create({
      colonyId: colony.id,
      depth: 'medium',
      frameCount: 10,
      pulledOn: day,
      fullGrams: 25_000,
      lotId,
    });
  return yard;
}

describe('public lot page', () => {
  it('shows floral source, harvest months (blends through their parents), yards without coordinates, mean water, best-before', async () => {
    await signInAs(null);
    const { LotParent, MoistureReading, BusinessSetting } = getDb().models;
    await BusinessSetting.update({ region: 'Marrow Valley' }, { where: { id: 1 } });
    const parent = await releasedLot(10_000, { floralSource: 'Spring blossom' });
    const blend = await releasedLot(20_000, { floralSource: 'Wildflower' });
    await blend.update({ isBlend: true, bestBeforeOn: '2028-08-31' });
    await LotParent.create({ childLotId: blend.id, parentLotId: parent.id, grams: 5_000 });
    const yardA = await pullsInto(parent.id, 'Orchard Terrace', ['2026-05-20', '2026-06-02']);
    const yardB = await pullsInto(blend.id, 'Fernbank', ['2026-08-10']);
    await MoistureReading.bulkCreate([
      {
        lotId: blend.id,
        method: 'scale',
        scaleWaterPct: 17.2,
        waterPct: 17.2,
        takenOn: '2026-08-20',
        recordedBy: null,
      },
      {
        lotId: blend.id,
        method: 'scale',
        scaleWaterPct: 17.6,
        waterPct: 17.6,
        takenOn: '2026-08-20',
        recordedBy: null,
      },
      {
        lotId: blend.id,
        method: 'scale',
        scaleWaterPct: 25,
        waterPct: 25,
        takenOn: '2026-08-20',
        recordedBy: null,
        voidedAt: new Date(),
        voidReason: 'wrong lot',
      },
    ]);
    const lot = await getPublicLot(blend.code);
    expect(lot).toMatchObject({
      floralSource: 'Wildflower',
      harvestMonths: ['2026-05', '2026-06', '2026-08'],
      waterPct: 17.4,
      bestBeforeOn: '2028-08-31',
      region: 'Marrow Valley',
      isBlend: true,
    });
    expect(lot?.yardNames.sort()).toEqual([yardA.name, yardB.name].sort());
    expect(JSON.stringify(lot)).not.toMatch(/51\.12|1\.65/);
  });

  it('a blend without its own readings shows its parents’ water, weighted by the grams each gave', async () => {
    const { LotParent, MoistureReading } = getDb().models;
    const a = await releasedLot(10_000);
    const b = await releasedLot(10_000);
    const blend = await releasedLot(4_000);
    await blend.update({ isBlend: true });
    await LotParent.bulkCreate([
      { childLotId: blend.id, parentLotId: a.id, grams: 1_000 },
      { childLotId: blend.id, parentLotId: b.id, grams: 3_000 },
    ]);
    await MoistureReading.bulkCreate([
      { lotId: a.id, method: 'scale', waterPct: 16.0, takenOn: '2026-08-20', recordedBy: null },
      { lotId: b.id, method: 'scale', waterPct: 18.0, takenOn: '2026-08-20', recordedBy: null },
    ]);
    // (16.0 × 1 kg + 18.0 × 3 kg) / 4 kg = 17.5 %
    expect(await getPublicLot(blend.code)).toMatchObject({ waterPct: 17.5, waterFromParents: true });
  });

  it('unknown codes and lots not yet on the shelf are a 404', async () => {
    await expect(PublicLotPage({ params: Promise.resolve({ code: 'NOPE-999' }) })).rejects.toThrow(/NEXT_NOT_FOUND/);
    const gathering = await releasedLot(1_000, { stage: 'extracted' });
    expect(await getPublicLot(gathering.code)).toBeNull();
  });
});
