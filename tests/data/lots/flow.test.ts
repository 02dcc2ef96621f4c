import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { refractiveIndexFromWater } from '@/lib/domain/moisture';
import {
  addContainerAction,
  addReadingAction,
  changeStageAction,
  updateLotAction,
  createBlendAction,
  createLotAction,
  scanSuperAction,
  voidRecordAction,
  emptyWeightAction,
} from '@/app/(back-office)/admin/lots/actions';
import { POST as uploadLabFile } from '@/app/api/lots/[id]/lab-files/route';
import { GET as downloadLabFile } from '@/app/api/lab-files/[id]/route';
import { getLotDetail } from '@/lib/data/lots/detail';
import { currentUser } from '@/lib/auth/session';
import { DEMO, signInAs } from '@/tests/support/session';
import { makePulledSupers } from '@/tests/support/lot-fixtures';
import { TINY_PDF } from '@/tests/support/files';

afterAll(closeDb);

const ok = <T>(r: { ok: boolean; data?: T; message?: string }): T => {
  if (!r.ok) throw new Error(`expected ok, got: ${r.message}`);
  return r.data as T;
};

/** An extracted lot with three supers, two containers (net 55 kg) and, optionally, one reading. */
async function extractedLot(waterPct?: number, opts: { heather?: boolean } = {}) {
  await signInAs(DEMO.crew);
  const { tags, supers } = await makePulledSupers(3);
  const lot = ok(await createLotAction({ floralSource: 'Test clover', heather: opts.heather ?? false, notes: '' })) as {
    id: number;
    code: string;
  };
  for (const tag of tags) ok(await scanSuperAction({ lotId: lot.id, tagCode: tag }));
  ok(await addContainerAction({ lotId: lot.id, label: 'B1', gross: 30, tare: 1, unit: 'kg' }));
  ok(await addContainerAction({ lotId: lot.id, label: 'B2', gross: 27, tare: 1, unit: 'kg' }));
  ok(await changeStageAction({ lotId: lot.id, target: 'extracted', extractedOn: '2026-07-25' }));
  if (waterPct !== undefined)
    ok(await addReadingAction({ lotId: lot.id, method: 'scale', scaleWaterPct: waterPct, takenOn: '2026-08-01' }));
  return { ...lot, supers };
}

const stageOf = async (id: number) => (await getDb().models.Lot.findByPk(id))!.stage;

function upload(lotId: number, bytes: Uint8Array, name: string, type: string, extra: Record<string, string> = {}) {
  const form = new FormData();
  form.set('file', new File([bytes as BlobPart], name, { type }));
  for (const [k, v] of Object.entries(extra)) form.set(k, v);
  return uploadLabFile(new Request(`http://t/api/lots/${lotId}/lab-files`, { method: 'POST', body: form }), {
    params: Promise.resolve({ id: String(lotId) }),
  });
}

describe('weights', () => {
  it('net = Σ (gross − tare) of non-voided containers; lb converts to grams; a void subtracts and is audited', async () => {
    const lot = await extractedLot();
    expect((await getDb().models.Lot.findByPk(lot.id))!.netGrams).toBe(55_000);
    ok(await addContainerAction({ lotId: lot.id, label: 'Pail', gross: 60, tare: 2, unit: 'lb' }));
    // 58 lb × 453.59237 g = 26 308.357… → 26 308 g (60 lb and 2 lb rounded separately: 27 216 − 907)
    expect((await getDb().models.Lot.findByPk(lot.id))!.netGrams).toBe(55_000 + 27_216 - 907);
    const pail = await getDb().models.LotContainer.findOne({ where: { lotId: lot.id, label: 'Pail' } });
    expect(
      await voidRecordAction({ lotId: lot.id, kind: 'container', recordId: pail!.id, reason: 'no' }),
    ).toMatchObject({ ok: false });
    ok(
      await voidRecordAction({
        lotId: lot.id,
        kind: 'container',
        recordId: pail!.id,
        reason: 'Weighed on the wrong scale',
      }),
    );
    expect((await getDb().models.Lot.findByPk(lot.id))!.netGrams).toBe(55_000);
    expect(await addContainerAction({ lotId: lot.id, label: 'Bad', gross: 1, tare: 2, unit: 'kg' })).toMatchObject({
      ok: false,
      fieldErrors: { gross: /more than the tare/ },
    });
  });

  it('a super’s empty weight makes its honey measured, and must be below its full weight', async () => {
    const lot = await extractedLot();
    expect(
      await emptyWeightAction({ lotId: lot.id, superPullId: lot.supers[0].id, empty: 40, unit: 'kg' }),
    ).toMatchObject({ ok: false, message: /less than the full/ });
    ok(await emptyWeightAction({ lotId: lot.id, superPullId: lot.supers[0].id, empty: 9, unit: 'kg' }));
    const detail = await getLotDetail((await currentUser())!, lot.id);
    expect(detail!.supers[0]).toMatchObject({ measured: true, honeyGrams: 27_000 - 9_000 });
    expect(detail!.yield.measuredCount).toBe(1);
    // the other two are estimated from the medium-super default (37.5 lb per 10 frames, common practice)
    expect(detail!.supers[1]).toMatchObject({ measured: false, honeyGrams: Math.round(37.5 * 453.59237) });
    expect(detail!.yield.expectedGrams).toBe(18_000 + 2 * Math.round(37.5 * 453.59237));
  });
});

describe('moisture and release', () => {
  it('a refractive index is converted at its temperature (Chataway/Wedmore, AOAC 969.38 B: 1.4865 at 20 °C = 20.0 %)', async () => {
    const lot = await extractedLot();
    const r = ok(
      await addReadingAction({
        lotId: lot.id,
        method: 'ri',
        refractiveIndex: 1.4842,
        temperatureC: 30,
        takenOn: '2026-08-01',
      }),
    ) as { waterPct: number };
    // +0.00023 per °C above 20 (temperature correction, AOAC 969.38 B): 1.4842 at 30 °C reads as 1.4865 → 20.0 %
    expect(Math.abs(r.waterPct - 20.0)).toBeLessThanOrEqual(0.03);
    expect(
      await addReadingAction({
        lotId: lot.id,
        method: 'ri',
        refractiveIndex: 1.4,
        temperatureC: 20,
        takenOn: '2026-08-01',
      }),
    ).toMatchObject({ ok: false, message: /not a honey reading/ });
  });

  it('cannot be released without a reading, and a reading over the limit holds it', async () => {
    const lot = await extractedLot();
    expect(await changeStageAction({ lotId: lot.id, target: 'released' })).toMatchObject({
      ok: false,
      message: /moisture reading/,
    });
    ok(await addReadingAction({ lotId: lot.id, method: 'scale', scaleWaterPct: 18.2, takenOn: '2026-08-01' }));
    ok(
      await addReadingAction({
        lotId: lot.id,
        method: 'ri',
        refractiveIndex: Number(refractiveIndexFromWater(21.2).toFixed(4)),
        temperatureC: 20,
        takenOn: '2026-08-02',
      }),
    );
    const result = ok(await changeStageAction({ lotId: lot.id, target: 'released' })) as {
      stage: string;
      holdReasons: string[];
    };
    expect(result.stage).toBe('held');
    expect(result.holdReasons.join(' ')).toMatch(/over the limit of 20 %/);
    expect(await stageOf(lot.id)).toBe('held');
  });

  it('details can change while the lot is open, with before and after in the history', async () => {
    const lot = await extractedLot();
    ok(
      await updateLotAction({
        lotId: lot.id,
        floralSource: 'Heather moor',
        heather: true,
        extractedOn: '2026-08-20',
        notes: 'Pressed combs',
      }),
    );
    const audit = await getDb().models.AuditEntry.findOne({
      where: { entityType: 'lot', entityId: String(lot.id), action: 'lot.update' },
    });
    expect(audit?.before).toMatchObject({ floralSource: 'Test clover', heather: false });
    expect(audit?.after).toMatchObject({
      floralSource: 'Heather moor',
      heather: true,
      extractedOn: '2026-08-20',
      notes: 'Pressed combs',
    });
  });

  it('the heather limit (23 %, EU 2001/110/EC Annex II) applies to a heather lot', async () => {
    const lot = await extractedLot(21.5, { heather: true });
    expect(ok(await changeStageAction({ lotId: lot.id, target: 'released' }))).toMatchObject({ stage: 'released' });
  });

  it('a held lot needs the owner and a written reason', async () => {
    const lot = await extractedLot(21);
    expect(ok(await changeStageAction({ lotId: lot.id, target: 'released' }))).toMatchObject({ stage: 'held' });
    expect(
      await changeStageAction({ lotId: lot.id, target: 'released', reason: 'Crew thinks it is fine' }),
    ).toMatchObject({ ok: false, message: /Only the owner/ });
    await signInAs(DEMO.owner);
    expect(await changeStageAction({ lotId: lot.id, target: 'released' })).toMatchObject({
      ok: false,
      message: /reason/,
    });
    ok(
      await changeStageAction({
        lotId: lot.id,
        target: 'released',
        reason: 'Re-tested after dehumidifying: sold for baking only',
      }),
    );
    expect(await stageOf(lot.id)).toBe('released');
    const audit = await getDb().models.AuditEntry.findOne({
      where: { entityType: 'lot', entityId: String(lot.id), action: 'lot.release_override' },
    });
    expect(audit?.reason).toMatch(/Re-tested/);
    expect(audit?.before).toMatchObject({ stage: 'held' });
  });

  it('a released lot refuses new containers and readings; corrections void with a reason', async () => {
    const lot = await extractedLot(17.5);
    ok(await changeStageAction({ lotId: lot.id, target: 'released' }));
    expect(await addContainerAction({ lotId: lot.id, label: 'Late', gross: 10, tare: 1, unit: 'kg' })).toMatchObject({
      ok: false,
      message: /released.*voiding/,
    });
    expect(
      await addReadingAction({ lotId: lot.id, method: 'scale', scaleWaterPct: 17, takenOn: '2026-08-03' }),
    ).toMatchObject({ ok: false, message: /released/ });
    expect(await updateLotAction({ lotId: lot.id, floralSource: 'Renamed', heather: true, notes: '' })).toMatchObject({
      ok: false,
      message: /released/,
    });
    const reading = await getDb().models.MoistureReading.findOne({ where: { lotId: lot.id } });
    ok(
      await voidRecordAction({
        lotId: lot.id,
        kind: 'reading',
        recordId: reading!.id,
        reason: 'Sample was from the wrong bucket',
      }),
    );
    const after = await getDb().models.MoistureReading.findByPk(reading!.id);
    expect(after!.voidedAt).not.toBeNull();
    expect(after!.voidReason).toMatch(/wrong bucket/);
  });

  it('every change to the lot is in its history with who, before and after', async () => {
    const lot = await extractedLot(17.5);
    ok(await changeStageAction({ lotId: lot.id, target: 'released' }));
    const rows = await getDb().models.AuditEntry.findAll({
      where: { entityType: 'lot', entityId: String(lot.id) },
      order: [['id', 'ASC']],
    });
    expect(rows.map((r) => r.action)).toEqual([
      'lot.create',
      'lot.super.add',
      'lot.super.add',
      'lot.super.add',
      'lot.container.add',
      'lot.container.add',
      'lot.stage.extracted',
      'lot.reading.add',
      'lot.stage.released',
    ]);
    const crew = await getDb().models.User.findOne({ where: { email: DEMO.crew } });
    expect(rows.every((r) => r.actorUserId === crew!.id)).toBe(true);
    expect(rows[5].after).toMatchObject({ netGrams: 55_000 });
    expect(rows[8].before).toMatchObject({ stage: 'extracted' });
    const detail = await getLotDetail((await currentUser())!, lot.id);
    expect(detail!.history).toHaveLength(9);
  });
});

describe('lab files', () => {
  const pdf = TINY_PDF;
  it('stores a PDF with its checksum and serves it as an attachment with nosniff', async () => {
    const lot = await extractedLot(17);
    const res = await upload(lot.id, pdf, 'lab report.pdf', 'application/pdf', { hmfMgKg: '12', diastaseSchade: '14' });
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.sha256).toMatch(/^[0-9a-f]{64}$/);
    const dl = await downloadLabFile(new Request(`http://t/api/lab-files/${body.id}`), {
      params: Promise.resolve({ id: String(body.id) }),
    });
    expect(dl.status).toBe(200);
    expect(dl.headers.get('content-type')).toBe('application/pdf');
    expect(dl.headers.get('content-disposition')).toMatch(/^attachment;/);
    expect(dl.headers.get('x-content-type-options')).toBe('nosniff');
    expect(new Uint8Array(await dl.arrayBuffer())).toEqual(pdf);
    await signInAs(DEMO.keeper2);
    const other = await downloadLabFile(new Request(`http://t/api/lab-files/${body.id}`), {
      params: Promise.resolve({ id: String(body.id) }),
    });
    expect(other.status).toBe(404);
  });

  it('refuses HTML named .pdf and an SVG, whatever the name or declared type', async () => {
    const lot = await extractedLot(17);
    const before = await getDb().models.LabFile.count();
    const html = await upload(
      lot.id,
      new TextEncoder().encode('<!DOCTYPE html><script>alert(1)</script>'),
      'results.pdf',
      'application/pdf',
    );
    expect(html.status).toBe(415);
    expect((await html.json()).error).toMatch(/web page/);
    const svg = await upload(
      lot.id,
      new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>'),
      'chart.png',
      'image/png',
    );
    expect(svg.status).toBe(415);
    expect((await svg.json()).error).toMatch(/SVG/);
    expect(await getDb().models.LabFile.count()).toBe(before);
  });

  it('failing lab results hold the lot on release (HMF over 40 mg/kg, EU 2001/110/EC Annex II)', async () => {
    const lot = await extractedLot(17);
    expect((await upload(lot.id, pdf, 'lab.pdf', 'application/pdf', { hmfMgKg: '55' })).status).toBe(201);
    const result = ok(await changeStageAction({ lotId: lot.id, target: 'released' })) as {
      stage: string;
      holdReasons: string[];
    };
    expect(result).toMatchObject({ stage: 'held' });
    expect(result.holdReasons.join(' ')).toMatch(/HMF 55 mg\/kg is above the 40/);
  });

  it('the HMF limit follows the lot’s own category: a tropical lot releases with HMF 60, a non-tropical lot is held (2001/110/EC Annex II 6(b))', async () => {
    const tropical = await extractedLot(17);
    ok(
      await updateLotAction({
        lotId: tropical.id,
        floralSource: 'Test clover',
        heather: false,
        tropical: true,
        notes: '',
      }),
    );
    expect((await upload(tropical.id, pdf, 'lab.pdf', 'application/pdf', { hmfMgKg: '60' })).status).toBe(201);
    const plain = await extractedLot(17);
    expect((await upload(plain.id, pdf, 'lab.pdf', 'application/pdf', { hmfMgKg: '60' })).status).toBe(201);

    expect(ok(await changeStageAction({ lotId: tropical.id, target: 'released' }))).toMatchObject({
      stage: 'released',
    });
    const held = ok(await changeStageAction({ lotId: plain.id, target: 'released' })) as { holdReasons: string[] };
    expect(held).toMatchObject({ stage: 'held' });
    expect(held.holdReasons.join(' ')).toMatch(/HMF 60 mg\/kg is above the 40 mg\/kg limit/);

    // the lot screen shows the verdict per criterion, with the category's limit
    const user = (await currentUser())!;
    const detail = await getLotDetail(user, tropical.id);
    expect(detail!.composition.find((r) => r.criterion === 'hmf')).toMatchObject({ value: 60, max: 80, pass: true });
    const plainDetail = await getLotDetail(user, plain.id);
    expect(plainDetail!.composition.find((r) => r.criterion === 'hmf')).toMatchObject({
      value: 60,
      max: 40,
      pass: false,
    });
  });

  it('the new lab fields are stored and checked: sucrose 12 g/100 g meets lavender’s 15, not the general 5 (Annex II 1.2)', async () => {
    const lavender = await extractedLot(17);
    ok(
      await updateLotAction({
        lotId: lavender.id,
        floralSource: 'Test lavender',
        heather: false,
        annexSource: 'lavender',
        notes: '',
      }),
    );
    const extra = { sucroseG100g: '12', fructoseGlucoseG100g: '65', conductivityMsCm: '0.4', freeAcidMeqKg: '20' };
    expect((await upload(lavender.id, pdf, 'lab.pdf', 'application/pdf', extra)).status).toBe(201);
    const plain = await extractedLot(17);
    expect((await upload(plain.id, pdf, 'lab.pdf', 'application/pdf', extra)).status).toBe(201);
    expect(ok(await changeStageAction({ lotId: lavender.id, target: 'released' }))).toMatchObject({
      stage: 'released',
    });
    const held = ok(await changeStageAction({ lotId: plain.id, target: 'released' })) as { holdReasons: string[] };
    expect(held.holdReasons.join(' ')).toMatch(/Sucrose 12 g\/100 g is above the 5 g\/100 g limit/);
    const row = await getDb().models.LabFile.findOne({ where: { lotId: lavender.id } });
    expect(Number(row!.conductivityMsCm)).toBe(0.4);
  });

  it('keepers cannot upload', async () => {
    const lot = await extractedLot(17);
    await signInAs(DEMO.keeper);
    expect((await upload(lot.id, pdf, 'lab.pdf', 'application/pdf')).status).toBe(403);
  });
});

describe('blends', () => {
  it('takes weight from released parents, water is the weight-weighted mean, and over-drawing is refused', async () => {
    const a = await extractedLot(17); // 55 kg
    ok(await changeStageAction({ lotId: a.id, target: 'released' }));
    const b = await extractedLot(19); // 55 kg
    ok(await changeStageAction({ lotId: b.id, target: 'released' }));
    const blend = ok(
      await createBlendAction({
        floralSource: 'Summer blend',
        notes: '',
        unit: 'kg',
        parts: [
          { lotId: a.id, amount: 30 },
          { lotId: b.id, amount: 10 },
        ],
      }),
    ) as { id: number; code: string };
    const detail = await getLotDetail((await currentUser())!, blend.id);
    expect(detail!.netGrams).toBe(40_000);
    // (30 × 17 + 10 × 19) / 40 = 17.5 %
    expect(detail!.water!.mean).toBeCloseTo(17.5, 2);
    expect(detail!.parents.map((p) => p.grams).sort()).toEqual([10_000, 30_000]);
    expect((await getDb().models.Lot.findByPk(a.id))!.usedGrams).toBe(30_000);

    const over = await createBlendAction({
      floralSource: 'Too much',
      notes: '',
      unit: 'kg',
      parts: [{ lotId: a.id, amount: 25.001 }],
    });
    expect(over).toMatchObject({ ok: false, message: /has only 25000 g left/ });
    expect((await getDb().models.Lot.findByPk(a.id))!.usedGrams).toBe(30_000);

    // two blends racing for the last 25 kg: exactly one wins
    const race = await Promise.all(
      [1, 2].map(() =>
        createBlendAction({ floralSource: 'Race', notes: '', unit: 'kg', parts: [{ lotId: a.id, amount: 20 }] }),
      ),
    );
    expect(race.filter((r) => r.ok)).toHaveLength(1);
    expect((await getDb().models.Lot.findByPk(a.id))!.usedGrams).toBe(50_000);

    // a blend releases on its parents' water
    expect(ok(await changeStageAction({ lotId: blend.id, target: 'released' }))).toMatchObject({ stage: 'released' });
  });

  it('refuses a parent that is not released', async () => {
    const held = await extractedLot(22);
    ok(await changeStageAction({ lotId: held.id, target: 'released' }));
    expect(
      await createBlendAction({ floralSource: 'Nope', notes: '', unit: 'kg', parts: [{ lotId: held.id, amount: 1 }] }),
    ).toMatchObject({ ok: false, message: /held: only released lots/ });
  });
});

describe('who may read a lot', () => {
  it('the keeper of its colonies reads it; another keeper gets nothing (404)', async () => {
    const lot = await extractedLot(17);
    await signInAs(DEMO.keeper);
    expect((await getLotDetail((await currentUser())!, lot.id))?.code).toBe(lot.code);
    await signInAs(DEMO.keeper2);
    expect(await getLotDetail((await currentUser())!, lot.id)).toBeNull();
  });
});
