import { PDFDocument } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { BUILT_IN_LAYOUTS } from '@/lib/domain/label-layout';
import type { LabelLayout } from '@/lib/domain/label-layout';
import { embedLora } from '@/lib/pdf/fonts';
import { pdfResponse, safePdfFilename } from '@/lib/pdf/response';
import { renderSuperTagSheet } from '@/lib/pdf/super-tags';
import { renderTableReport } from '@/lib/pdf/table-report';
import { decodePng } from './decode';
import { hasPoppler, pdfPagePng, pdfText } from './poppler';

const a4x21 = BUILT_IN_LAYOUTS.find((l) => l.paper === 'a4' && l.columns * l.rows === 21) as LabelLayout;
const roll = BUILT_IN_LAYOUTS.find((l) => l.paper === 'roll') as LabelLayout;

describe('super tag sheet', () => {
  const tags = Array.from({ length: 25 }, (_, i) => ({
    code: `SUP-${String(i + 1).padStart(4, '0')}`,
    caption: 'Quarry Meadow',
  }));

  it('is a valid PDF with one label per tag', async () => {
    const doc = await PDFDocument.load(await renderSuperTagSheet(tags, a4x21));
    expect(doc.getPageCount()).toBe(2); // 25 tags, 21 per A4 sheet
  });
  it('refuses codes a Code 128 symbol cannot carry', async () => {
    await expect(renderSuperTagSheet([{ code: 'SUP 1' }], a4x21)).rejects.toThrow(/printable ASCII/);
    await expect(renderSuperTagSheet([{ code: 'Größe' }], a4x21)).rejects.toThrow(/printable ASCII/);
    await expect(renderSuperTagSheet([], a4x21)).rejects.toThrow(/No super tags/);
  });
  it.skipIf(!hasPoppler)('shows each code and scans from a 300 dpi rendering', async () => {
    expect(pdfText(await renderSuperTagSheet(tags, a4x21))).toContain('SUP-0025');
    const png = pdfPagePng(await renderSuperTagSheet([{ code: 'SUP-0042', caption: 'Fernbank' }], roll), 300);
    expect(decodePng(png, 'code128')).toBe('SUP-0042');
  });
});

describe('table report', () => {
  const rows = Array.from({ length: 120 }, (_, i) => [
    `C-${i + 1}`,
    ['Orchard Terrace', 'Linden Row', 'Quarry Meadow', 'Fernbank'][i % 4],
    (i * 1.5).toFixed(1),
  ]);
  const report = {
    title: 'Yield by colony — 2026',
    subtitle: 'Hollowmere Apiaries, Marrow Valley',
    sections: [
      {
        heading: 'Colonies',
        columns: ['Colony', 'Yard', 'Honey (kg)'],
        rows,
        note: 'Lot weight shared back by measured honey weight.',
      },
      { heading: 'Held lots', columns: ['Lot', 'Reason'], rows: [] },
    ],
    footer: 'Combtrace records and warns; it does not certify.',
  };

  it('breaks pages and is a valid A4 PDF', async () => {
    const doc = await PDFDocument.load(await renderTableReport(report));
    expect(doc.getPageCount()).toBeGreaterThanOrEqual(3); // 120 rows of ~15 pt on ~730 pt of body per page
    expect(doc.getPage(0).getHeight()).toBeCloseTo(841.89, 1); // A4 height in points (ISO 216)
  });
  it.skipIf(!hasPoppler)('numbers its pages and repeats the rows it was given', async () => {
    const bytes = await renderTableReport(report);
    const pages = (await PDFDocument.load(bytes)).getPageCount();
    const text = pdfText(bytes);
    expect(text).toContain(`Page 1 of ${pages}`);
    expect(text).toContain(`Page ${pages} of ${pages}`);
    expect(text).toContain('C-120');
    expect(text).toContain('No rows.');
    expect(text).toContain('Combtrace records and warns; it does not certify.');
  });
});

describe('fonts', () => {
  it('embeds each Lora weight once per document', async () => {
    const doc = await PDFDocument.create();
    const [a, b] = [await embedLora(doc, 700), await embedLora(doc, 700)];
    expect(a).toBe(b);
    expect(a.widthOfTextAtSize('Łódź', 10)).toBeGreaterThan(0);
  });
});

describe('pdfResponse', () => {
  it('streams the bytes in chunks with download and no-store headers', async () => {
    const bytes = new Uint8Array(200_000).map((_, i) => i % 251);
    const response = pdfResponse(bytes, 'Lot HH26/014 "labels".pdf');
    expect(response.headers.get('Content-Type')).toBe('application/pdf');
    expect(response.headers.get('Content-Disposition')).toBe('attachment; filename="Lot_HH26_014_labels.pdf"');
    expect(response.headers.get('Cache-Control')).toBe('private, no-store');
    expect(response.headers.get('X-Content-Type-Options')).toBe('nosniff');
    const reader = response.body?.getReader();
    expect(reader).toBeDefined();
    const chunks: Uint8Array[] = [];
    for (let r = await reader?.read(); r && !r.done; r = await reader?.read()) chunks.push(r.value);
    expect(chunks.length).toBeGreaterThan(1);
    expect(Buffer.concat(chunks).equals(Buffer.from(bytes))).toBe(true);
  });
  it('sanitises file names', () => {
    expect(safePdfFilename('../../etc/passwd')).toBe('etc_passwd.pdf');
    expect(safePdfFilename('Löwe labels')).toBe('Lowe_labels.pdf'); // NFKD splits ö into o + combining mark
    expect(safePdfFilename('Größe')).toBe('Gro_e.pdf'); // ß has no decomposition
    expect(safePdfFilename('"\r\n')).toBe('document.pdf');
    expect(safePdfFilename('x'.repeat(300))).toHaveLength(100);
  });
});
