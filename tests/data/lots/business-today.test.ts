import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { changeLotStage } from '@/lib/data/lots/stage';
import { createBlend } from '@/lib/data/lots/blends';
import type { SessionUser } from '@/lib/auth/session';

/**
 * Dates in the business time zone, not UTC: the extraction date and the blend date are the
 * business's "today" (settings.timeZone, IANA time zone database). At 02:30 UTC on 2 March it is
 * still 1 March in New York (UTC−5 until 8 March 2026).
 */
const NOW = new Date('2026-03-02T02:30:00Z');
let seq = 0;

afterEach(async () => {
  vi.useRealTimers();
  await getDb().models.BusinessSetting.update({ timeZone: 'UTC' }, { where: { id: 1 } });
});
afterAll(closeDb);

async function owner(): Promise<SessionUser> {
  const u = (await getDb().models.User.findOne({ where: { email: 'owner@hollowmere.test' } }))!;
  return { id: u.id, name: u.name, email: u.email, role: 'owner' };
}

describe('dates in the business time zone, not UTC', () => {
  it('at 21:30 on 1 March in New York, 2 March (UTC already) is after today; 1 March is accepted', async () => {
    const { models } = getDb();
    await models.BusinessSetting.update({ timeZone: 'America/New_York' }, { where: { id: 1 } });
    const lot = await models.Lot.create({ code: `TZ${process.pid % 10000}-${++seq}`, createdBy: null });
    await models.LotContainer.create({
      lotId: lot.id,
      label: 'B1',
      grossGrams: 30_000,
      tareGrams: 1_000,
      recordedBy: null,
    });
    await lot.update({ netGrams: 29_000 });
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(NOW);
    // The form offers today in the business's zone; a date after that day is refused.
    await expect(changeLotStage(await owner(), lot.id, 'extracted', undefined, '2026-03-02')).rejects.toThrow(
      /cannot be after today \(2026-03-01\)/,
    );
    await changeLotStage(await owner(), lot.id, 'extracted', undefined, '2026-03-01');
    expect((await models.Lot.findByPk(lot.id))!.extractedOn).toBe('2026-03-01');
  });

  it('a blend made then is dated 1 March', async () => {
    const { models } = getDb();
    await models.BusinessSetting.update({ timeZone: 'America/New_York' }, { where: { id: 1 } });
    const parent = await models.Lot.create({
      code: `TZ${process.pid % 10000}-${++seq}`,
      stage: 'released',
      extractedOn: '2025-09-01',
      netGrams: 10_000,
      createdBy: null,
    });
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(NOW);
    const blend = await createBlend(await owner(), {
      floralSource: 'Night blend',
      parts: [{ lotId: parent.id, grams: 1_000 }],
    });
    expect((await models.Lot.findByPk(blend.id))!.extractedOn).toBe('2026-03-01');
  });
});
