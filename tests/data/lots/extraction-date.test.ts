import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { bestBeforeDate } from '@/lib/domain/jars';
import {
  addContainerAction,
  changeStageAction,
  createLotAction,
  scanSuperAction,
  updateLotAction,
} from '@/app/(back-office)/admin/lots/actions';
import { DEMO, signInAs } from '@/tests/support/session';
import { makePulledSupers } from '@/tests/support/lot-fixtures';

afterAll(closeDb);

const ok = <T>(r: { ok: boolean; data?: T; message?: string }): T => {
  if (!r.ok) throw new Error(`expected ok, got: ${r.message}`);
  return r.data as T;
};

async function gatheringLot() {
  await signInAs(DEMO.crew);
  const { tags } = await makePulledSupers(1);
  const lot = ok(await createLotAction({ floralSource: 'Test lime', heather: false, notes: '' })) as {
    id: number;
    code: string;
  };
  ok(await scanSuperAction({ lotId: lot.id, tagCode: tags[0] }));
  ok(await addContainerAction({ lotId: lot.id, label: 'B1', gross: 20, tare: 1, unit: 'kg' }));
  return lot;
}
const months = async () => (await getDb().models.BusinessSetting.findByPk(1))!.bestBeforeMonths;
const details = (lotId: number, extractedOn: string) =>
  updateLotAction({ lotId, floralSource: 'Test lime', heather: false, extractedOn, notes: '' });

describe('the extraction date gives the best-before', () => {
  it('"mark extracted" needs the extraction date and returns the best-before it gives', async () => {
    const lot = await gatheringLot();
    expect(await changeStageAction({ lotId: lot.id, target: 'extracted' })).toMatchObject({
      ok: false,
      message: /Give the extraction date/,
    });
    expect(await changeStageAction({ lotId: lot.id, target: 'extracted', extractedOn: '2099-01-01' })).toMatchObject({
      ok: false,
      message: /cannot be after today/,
    });
    expect((await getDb().models.Lot.findByPk(lot.id))!.stage).toBe('gathering');
    const expected = bestBeforeDate('2026-07-25', await months());
    expect(await changeStageAction({ lotId: lot.id, target: 'extracted', extractedOn: '2026-07-25' })).toEqual({
      ok: true,
      data: { stage: 'extracted', holdReasons: [], extractedOn: '2026-07-25', bestBeforeOn: expected },
    });
    expect(await getDb().models.Lot.findByPk(lot.id)).toMatchObject({
      extractedOn: '2026-07-25',
      bestBeforeOn: expected,
    });
  });

  it('correcting the extraction date before any jar recomputes the best-before', async () => {
    const lot = await gatheringLot();
    ok(await changeStageAction({ lotId: lot.id, target: 'extracted', extractedOn: '2026-07-25' }));
    expect(await details(lot.id, '2026-07-20')).toEqual({ ok: true });
    expect(await getDb().models.Lot.findByPk(lot.id)).toMatchObject({
      extractedOn: '2026-07-20',
      bestBeforeOn: bestBeforeDate('2026-07-20', await months()),
    });
  });

  it('correcting the extraction date after jars carry the best-before is refused with the reason', async () => {
    const lot = await gatheringLot();
    const data = ok(await changeStageAction({ lotId: lot.id, target: 'extracted', extractedOn: '2026-07-25' })) as {
      bestBeforeOn: string;
    };
    const product = await getDb().models.Product.findOne();
    await getDb().models.StockLevel.create({
      productId: product!.id,
      lotId: lot.id,
      onHand: 12,
      reserved: 0,
      bestBeforeOn: data.bestBeforeOn,
    });
    expect(await details(lot.id, '2026-07-20')).toMatchObject({
      ok: false,
      message: new RegExp(`already carry best-before ${data.bestBeforeOn}.*can no longer change`),
    });
    expect(await getDb().models.Lot.findByPk(lot.id)).toMatchObject({
      extractedOn: '2026-07-25',
      bestBeforeOn: data.bestBeforeOn,
    });
    // The other details can still be saved with the same date.
    expect(await details(lot.id, '2026-07-25')).toEqual({ ok: true });
  });
});
