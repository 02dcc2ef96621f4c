import 'server-only';
import { rgb } from 'pdf-lib';
import type { PDFFont } from 'pdf-lib';
import { gs1BarcodePng, qrPng } from '@/lib/barcode';
import type { Gs1BarcodeKind } from '@/lib/barcode';
import { gs1HumanReadable } from '@/lib/domain/gs1';
import { cleanText } from './fonts';
import type { LabelContent } from './label-content';
import { LINE_HEIGHT, fitBlocks, textWidth } from './text';
import type { TextBlock } from './text';

/** Where text, barcodes and the QR code go on one jar label. */

// Infant botulism advice: honey is not for infants under 12 months (CDC; American Academy of Pediatrics).
const INFANT_CAUTION = 'Not for infants under 12 months.';

export const INK = rgb(0, 0, 0);
// Pixels per module of 2D symbols embedded in PDFs: exact at any size when the viewer
// does not smooth images (pdf-lib sets no /Interpolate); 3 limits the blur where it does.
const PDF_2D_SCALE = 3;

export type LabelFonts = { regular: PDFFont; bold: PDFFont };
type PlacedText = { text: string; font: PDFFont; size: number; x: number; y: number };
export type PlacedImage = {
  key: string;
  load: () => Promise<Buffer>;
  x: number;
  y: number;
  width: number;
  height: number;
};
export type LabelPlan = { texts: PlacedText[]; images: PlacedImage[] };

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

function textBlocks(label: LabelContent, fonts: LabelFonts, hri: string | null): TextBlock[] {
  const floral = cleanText(label.floralSource);
  const bestBefore = cleanText(label.bestBeforeText);
  const blocks: TextBlock[] = [
    { text: cleanText(label.productName), font: fonts.bold, size: 10, minSize: 5, maxLines: 2 },
    {
      text: floral ? `Honey — ${floral}` : 'Honey',
      font: fonts.regular,
      size: 7,
      minSize: 4.5,
      maxLines: 1,
      dropPriority: 3,
    },
    // The declaration keeps a larger minimum: it is what weights-and-measures inspectors read.
    { text: cleanText(label.netQuantity), font: fonts.bold, size: 8, minSize: 5.5, maxLines: 2 },
    { text: cleanText(label.businessName), font: fonts.regular, size: 6, minSize: 4, maxLines: 2 },
    { text: cleanText(label.businessAddress), font: fonts.regular, size: 6, minSize: 4, maxLines: 2, dropPriority: 4 },
    { text: `Lot ${cleanText(label.lotCode)}`, font: fonts.bold, size: 6.5, minSize: 4.5, maxLines: 1 },
    {
      text: /^best before/i.test(bestBefore) ? bestBefore : `Best before ${bestBefore}`,
      font: fonts.regular,
      size: 6.5,
      minSize: 4.5,
      maxLines: 2,
    },
    { text: INFANT_CAUTION, font: fonts.regular, size: 5.5, minSize: 4, maxLines: 2 },
  ];
  if (hri) blocks.push({ text: hri, font: fonts.regular, size: 4.5, minSize: 3.5, maxLines: 2, dropPriority: 2 });
  return blocks;
}

/** Top-aligned column of fitted text, starting at (x, top). */
function placeColumn(
  blocks: TextBlock[],
  x: number,
  top: number,
  width: number,
  height: number,
  maxScale: number,
): PlacedText[] {
  const placed: PlacedText[] = [];
  let cursor = top;
  for (const block of fitBlocks(blocks, width, height, maxScale).blocks) {
    for (const line of block.lines) {
      placed.push({ text: line, font: block.font, size: block.size, x, y: cursor - block.size * 0.92 });
      cursor -= block.size * LINE_HEIGHT;
    }
  }
  return placed;
}

/** Where everything goes on one label, relative to the label's bottom-left corner. */
export function planLabel(
  label: LabelContent,
  width: number,
  height: number,
  kind: Gs1BarcodeKind,
  fonts: LabelFonts,
): LabelPlan {
  const element = gs1HumanReadable({ gtin: label.gtin, bestBefore: label.bestBefore, lot: label.lotCode });
  const url = label.publicUrl.trim();
  const pad = clamp(Math.min(width, height) * 0.06, 4, 8);
  const gap = pad * 0.6;
  const w = width - 2 * pad;
  const h = height - 2 * pad;
  const maxScale = clamp(h / 95, 1, 1.6); // 95 pt: the inner height of a 38.1 mm label
  const qr = (x: number, y: number, s: number): PlacedImage => ({
    key: `qr:${url}`,
    load: () => qrPng(url, { scale: PDF_2D_SCALE }),
    x,
    y,
    width: s,
    height: s,
  });

  if (kind === 'gs1-128') {
    // Bars across the full width with the HRI below (GS1 General Specifications §4.15, HRI rules — from memory).
    const hriSize = clamp(Math.min(h * 0.055, (w * 0.98) / textWidth(fonts.regular, element, 1)), 3, 6.5);
    const barHeight = clamp(h * 0.24, 12, 40);
    const barY = pad + hriSize * 1.25;
    const topHeight = h - (barY - pad) - barHeight - gap;
    const q = Math.min(topHeight, w * 0.3);
    const hriX = pad + (w - textWidth(fonts.regular, element, hriSize)) / 2;
    return {
      texts: [
        ...placeColumn(textBlocks(label, fonts, null), pad, pad + h, w - q - gap, topHeight, maxScale),
        { text: element, font: fonts.regular, size: hriSize, x: hriX, y: pad + hriSize * 0.25 },
      ],
      images: [
        // A one-module-high strip: the PDF stretches bars vertically without loss.
        {
          key: `128:${element}`,
          load: () => gs1BarcodePng(element, 'gs1-128', { includeText: false, scale: 3, barHeightMm: 1 }),
          x: pad,
          y: barY,
          width: w,
          height: barHeight,
        },
        ...(url ? [qr(pad + w - q, pad + h - q, q)] : []),
      ],
    };
  }

  // DataMatrix and QR stacked on the right, or side by side on a short label.
  const stacked = Math.min(w * 0.3, (h - gap) / 2);
  const sideBySide = Math.min((w * 0.45 - gap) / 2, h);
  const images: PlacedImage[] = [];
  let codesWidth: number;
  const dm = (x: number, y: number, s: number): PlacedImage => ({
    key: `dm:${element}`,
    load: () => gs1BarcodePng(element, 'gs1datamatrix', { scale: PDF_2D_SCALE }),
    x,
    y,
    width: s,
    height: s,
  });
  if (stacked >= sideBySide || !url) {
    const s = url ? stacked : Math.min(w * 0.3, h);
    images.push(dm(pad + w - s, pad + h - s, s));
    if (url) images.push(qr(pad + w - s, pad, s));
    codesWidth = s;
  } else {
    images.push(
      dm(pad + w - 2 * sideBySide - gap, pad + h - sideBySide, sideBySide),
      qr(pad + w - sideBySide, pad + h - sideBySide, sideBySide),
    );
    codesWidth = 2 * sideBySide + gap;
  }
  const hri = element.replace('(15)', ' (15)').replace('(10)', ' (10)');
  return { texts: placeColumn(textBlocks(label, fonts, hri), pad, pad + h, w - codesWidth - gap, h, maxScale), images };
}
