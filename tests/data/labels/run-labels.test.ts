import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PDFDocument } from 'pdf-lib';
import { closeDb, getDb } from '@/lib/db/index';
import { DEMO, signInAs } from '@/tests/support/session';
import { GET } from '@/app/api/jarring/[id]/labels/route';
import { createJarringRunAction } from '@/app/(back-office)/admin/jarring/actions';
import { saveLabelLayoutAction } from '@/app/(back-office)/admin/labels/actions';
import { parseGs1ElementString } from '@/lib/domain/gs1';
import { decodePng } from '@/tests/pdf/decode';
import { hasPoppler, pdfPagePng, pdfText } from '@/tests/pdf/poppler';
import { key, product, releasedLot, samples, weighed } from '@/tests/support/jarring-fixtures';

afterAll(closeDb);

let runId = 0;
let lotCode = '';
const labels = (query = '') =>
  GET(new Request(`http://test/api/jarring/${runId}/labels${query}`), {
    params: Promise.resolve({ id: String(runId) }),
  });

beforeAll(async () => {
  await getDb().models.BusinessSetting.update(
    { labelDeclaration: 'us-dual', barcodeKind: 'gs1-128', bestBeforeMonths: 24, fillRuleSet: 'oiml' },
    { where: { id: 1 } },
  );
  await signInAs(DEMO.crew);
  const lot = await releasedLot(30_000, { extractedOn: '2026-08-20', floralSource: 'Linden' });
  lotCode = lot.code;
  // GTIN: GS1's worked example 629104150021 + check digit 3 (GS1 General Specifications §7.9.1)
  const jar = await product({ netGrams: 340, declaredUnit: 'oz', declaredAmount: 12, gtin: '6291041500213' });
  const res = await createJarringRunAction({
    lotId: lot.id,
    productId: jar.id,
    jarCount: 25,
    runOn: '2026-09-02',
    sampleMode: 'net',
    samples: weighed(25, 342, 343, 341), // a batch under 100 is weighed whole (76/211/EEC Annex II 2.1.3)
    idempotencyKey: key(),
  });
  if (!res.ok) throw new Error(res.message);
  runId = res.data.runId;
});

describe('label PDF of a jarring run', () => {
  it('is a download with one label per jar (A4 3×7: 25 labels → 2 pages)', async () => {
    const res = await labels('?layout=b0');
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="labels-.*\.pdf"$/);
    const doc = await PDFDocument.load(new Uint8Array(await res.arrayBuffer()));
    expect(doc.getPageCount()).toBe(2);
  });

  it('preview is the first page only, inline', async () => {
    const res = await labels('?layout=b0&start=5&preview=1');
    expect(res.headers.get('content-disposition')).toMatch(/^inline/);
    expect((await PDFDocument.load(new Uint8Array(await res.arrayBuffer()))).getPageCount()).toBe(1);
  });

  it.skipIf(!hasPoppler)(
    'reads back lot code, the US dual declaration, best-before and the infant caution',
    async () => {
      const text = pdfText(new Uint8Array(await (await labels('?layout=b0')).arrayBuffer()));
      expect(text).toContain(`Lot ${lotCode}`);
      // 16 CFR 500.19 / FDA Food Labeling Guide: dual units; 12 oz = 340.19 g, rounded down to 3 significant figures (NIST HB 130)
      expect(text).toContain('NET WT 12 OZ (340 g)');
      // best before = extraction 2026-08-20 + 24 months (owner setting)
      expect(text).toContain('Best before 20 Aug 2028');
      expect(text).toContain('Not for infants under 12 months.');
      expect(text).toContain('Hollowmere Apiaries');
      expect(text).toContain('Honey — Linden');
    },
  );

  it.skipIf(!hasPoppler)('its GS1-128 decodes (@zxing/library) to (01) GTIN, (15) best-before, (10) lot', async () => {
    const bytes = new Uint8Array(await (await labels('?layout=b4&copies=1')).arrayBuffer());
    const decoded = decodePng(pdfPagePng(bytes, 300), 'code128');
    expect(decoded).toBe(`]C1010629104150021315280820` + `10${lotCode}`);
    expect(parseGs1ElementString(decoded)).toEqual({ gtin: '06291041500213', bestBefore: '2028-08-20', lot: lotCode });
  });

  it('keepers may read runs but not print; signed-out visitors are asked to sign in', async () => {
    await signInAs(DEMO.keeper);
    expect((await labels()).status).toBe(403);
    await signInAs(null);
    expect((await labels()).status).toBe(401);
    await signInAs(DEMO.crew);
  });

  it('a product without a GTIN gets a plain 409', async () => {
    const lot = await releasedLot(5_000);
    const jar = await product({ gtin: null });
    const res = await createJarringRunAction({
      lotId: lot.id,
      productId: jar.id,
      jarCount: 2,
      runOn: '2026-09-02',
      sampleMode: 'net',
      samples: samples(345),
      idempotencyKey: key(),
    });
    const id = res.ok ? res.data.runId : 0;
    const out = await GET(new Request(`http://test/api/jarring/${id}/labels`), {
      params: Promise.resolve({ id: String(id) }),
    });
    expect(out.status).toBe(409);
    expect((await out.json()).error).toMatch(/no GTIN/);
  });

  it('prints on an owner-saved layout; a layout that does not fit its paper is refused; crew cannot save layouts', async () => {
    const layout = {
      name: `Test 2x4 ${Date.now()}`,
      paper: 'letter' as const,
      labelWidthMm: 100,
      labelHeightMm: 60,
      columns: 2,
      rows: 4,
      marginTopMm: 10,
      marginLeftMm: 5,
      gapXMm: 3,
      gapYMm: 2,
      offsetXMm: 0.5,
      offsetYMm: -0.5,
    };
    expect(await saveLabelLayoutAction(layout)).toMatchObject({
      ok: false,
      message: expect.stringMatching(/not allowed/),
    });
    await signInAs(DEMO.owner);
    // Letter is 215.9 mm wide (ANSI/ASME Y14.1): 5 + 3 × 100 + 2 × 3 = 311 mm does not fit
    expect(await saveLabelLayoutAction({ ...layout, columns: 3 })).toMatchObject({
      ok: false,
      message: expect.stringMatching(/too wide for LETTER/),
    });
    const saved = await saveLabelLayoutAction(layout);
    expect(saved.ok).toBe(true);
    await signInAs(DEMO.crew);
    const res = await labels(`?layout=s${saved.ok ? saved.data.id : 0}`);
    const doc = await PDFDocument.load(new Uint8Array(await res.arrayBuffer()));
    expect(doc.getPageCount()).toBe(4); // 25 labels, 8 per sheet
    expect(doc.getPage(0).getWidth()).toBeCloseTo(612, 0); // 8.5 in × 72
  });
});
