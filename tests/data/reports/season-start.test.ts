import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { listSeasons, seasonLots } from '@/lib/data/reports/yield-sql';
import { insert } from '@/tests/support/report-fixtures';

/**
 * The season is not the calendar year: with the owner's season starting in July (much of the
 * southern hemisphere), honey extracted in November and in February is one season's, named by the
 * year it starts in.
 */
let nov: number;
let feb: number;
let aug: number;

beforeAll(async () => {
  const lot = (code: string, extractedOn: string) =>
    insert('lots', { code, floral_source: 'Manuka', stage: 'extracted', extracted_on: extractedOn, net_grams: 1000 });
  nov = await lot('SS40-001', '2040-11-20');
  feb = await lot('SS41-001', '2041-02-10');
  aug = await lot('SS41-002', '2041-08-05');
});
afterAll(async () => {
  await getDb().models.BusinessSetting.update({ seasonStartMonth: 1 }, { where: { id: 1 } });
  await closeDb();
});

const idsIn = async (season: number) =>
  (await seasonLots(season)).map((l) => l.id).filter((id) => [nov, feb, aug].includes(id));

describe('the season is not the calendar year', () => {
  it('reports group lots by the season that starts in the owner’s month, not by calendar year', async () => {
    await getDb().models.BusinessSetting.update({ seasonStartMonth: 7 }, { where: { id: 1 } });
    expect((await idsIn(2040)).sort()).toEqual([nov, feb].sort());
    expect(await idsIn(2041)).toEqual([aug]);
    expect(await listSeasons()).toEqual(expect.arrayContaining([2040, 2041]));
    expect(await listSeasons()).not.toContain(2042);
  });

  it('a January start keeps the calendar year', async () => {
    await getDb().models.BusinessSetting.update({ seasonStartMonth: 1 }, { where: { id: 1 } });
    expect(await idsIn(2040)).toEqual([nov]);
    expect((await idsIn(2041)).sort()).toEqual([feb, aug].sort());
  });
});
