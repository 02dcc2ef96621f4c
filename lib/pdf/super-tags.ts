import 'server-only';
import { PDFDocument, rgb } from 'pdf-lib';
import type { PDFImage, PDFPage } from 'pdf-lib';
import { code128Png } from '@/lib/barcode';
import { labelPositions, validateLayout } from '@/lib/domain/label-layout';
import type { LabelLayout } from '@/lib/domain/label-layout';
import { cleanText, embedLora } from './fonts';
import { ellipsize, textWidth } from './text';

export type SuperTag = { code: string; caption?: string };

const MAX_TAGS_PER_DOCUMENT = 5_000;

const INK = rgb(0, 0, 0);

/** Code 128 (ISO/IEC 15417) carries ASCII 0–127; tag codes are printable ASCII. */
function assertTagCode(code: string): void {
  if (!/^[\x21-\x7e]{1,40}$/.test(code)) {
    throw new Error(`Super tag code "${code}" must be 1–40 printable ASCII characters without spaces`);
  }
}

/** One tag per label: a Code 128 barcode of the code, the code in large type, an optional caption. */
export async function renderSuperTagSheet(tags: SuperTag[], layout: LabelLayout): Promise<Uint8Array> {
  const errors = validateLayout(layout);
  if (errors.length > 0) throw new Error(`Label layout "${layout.name}": ${errors.join(' ')}`);
  if (tags.length === 0) throw new RangeError('No super tags to print');
  if (tags.length > MAX_TAGS_PER_DOCUMENT) throw new RangeError(`At most ${MAX_TAGS_PER_DOCUMENT} tags per document`);
  for (const tag of tags) assertTagCode(tag.code);

  const { pageWidthPt, pageHeightPt, slots } = labelPositions(layout);
  const doc = await PDFDocument.create();
  doc.setTitle('Super tags');
  doc.setCreator('Combtrace');
  const [regular, bold] = await Promise.all([embedLora(doc, 400), embedLora(doc, 700)]);
  const images = new Map<string, Promise<PDFImage>>();
  const { widthPt: width, heightPt: height } = slots[0];
  const pad = Math.min(8, Math.max(4, Math.min(width, height) * 0.06));
  const w = width - 2 * pad;
  const h = height - 2 * pad;

  let page: PDFPage | null = null;
  for (const [i, tag] of tags.entries()) {
    const slot = slots[i % slots.length];
    if (i % slots.length === 0) page = doc.addPage([pageWidthPt, pageHeightPt]);
    if (!page) throw new Error('unreachable: no page');
    let image = images.get(tag.code);
    if (!image) {
      image = code128Png(tag.code, { includeText: false }).then((png) => doc.embedPng(png));
      images.set(tag.code, image);
    }
    const caption = cleanText(tag.caption ?? '');
    const captionSize = Math.min(9, Math.max(5, h * 0.09));
    let y = slot.yPt + pad;
    if (caption) {
      page.drawText(ellipsize(caption, regular, captionSize, w), {
        x: slot.xPt + pad,
        y: y + captionSize * 0.25,
        size: captionSize,
        font: regular,
        color: INK,
      });
      y += captionSize * 1.3;
    }
    // The code as large as fits: at most 30 % of the label's height.
    const codeSize = Math.max(6, Math.min(h * 0.3, w / textWidth(bold, tag.code, 1)));
    const codeWidth = textWidth(bold, tag.code, codeSize);
    page.drawText(tag.code, {
      x: slot.xPt + pad + Math.max(0, (w - codeWidth) / 2),
      y: y + codeSize * 0.2,
      size: codeSize,
      font: bold,
      color: INK,
    });
    y += codeSize * 1.1;
    const barHeight = slot.yPt + pad + h - y;
    if (barHeight > 6) page.drawImage(await image, { x: slot.xPt + pad, y, width: w, height: barHeight });
  }
  return doc.save();
}
