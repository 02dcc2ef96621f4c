import 'server-only';
import {
  PDFDocument,
  concatTransformationMatrix,
  degrees,
  drawImage,
  drawObject,
  drawText,
  popGraphicsState,
  pushGraphicsState,
} from 'pdf-lib';
import type { PDFFont, PDFImage, PDFName, PDFOperator, PDFPage, PDFRef } from 'pdf-lib';
import type { Gs1BarcodeKind } from '@/lib/barcode';
import { labelPositions, validateLayout } from '@/lib/domain/label-layout';
import type { LabelLayout } from '@/lib/domain/label-layout';
import { embedLora } from './fonts';
import { INK, planLabel } from './label-plan';
import type { LabelFonts, LabelPlan, PlacedImage } from './label-plan';
import type { LabelContent } from './label-content';

export type LabelSheetInput = {
  layout: LabelLayout;
  labels: LabelContent[];
  barcodeKind: Gs1BarcodeKind;
  startSlot?: number;
};

/** A sheet request larger than this is refused (about 480 A4 sheets of 21). */
const MAX_LABELS_PER_DOCUMENT = 10_000;

function countCopies(labels: LabelContent[]): number {
  let total = 0;
  for (const label of labels) {
    const copies = label.copies ?? 1;
    if (!Number.isInteger(copies) || copies < 0) throw new RangeError(`Copies must be a whole number, got ${copies}`);
    total += copies;
  }
  return total;
}

/**
 * A PDF of label sheets. Each distinct barcode image is embedded once (embedPng) and
 * each distinct label is drawn once as a form XObject that every copy reuses.
 */
export async function renderLabelSheet(input: LabelSheetInput): Promise<Uint8Array> {
  const { layout, labels, barcodeKind } = input;
  const errors = validateLayout(layout);
  if (errors.length > 0) throw new Error(`Label layout "${layout.name}": ${errors.join(' ')}`);
  const total = countCopies(labels);
  if (total === 0) throw new RangeError('No labels to print');
  if (total > MAX_LABELS_PER_DOCUMENT) throw new RangeError(`At most ${MAX_LABELS_PER_DOCUMENT} labels per document`);
  const { pageWidthPt, pageHeightPt, slots } = labelPositions(layout);
  const startSlot = layout.paper === 'roll' ? 0 : (input.startSlot ?? 0);
  if (!Number.isInteger(startSlot) || startSlot < 0 || startSlot >= slots.length) {
    throw new RangeError(`Start slot must be 0–${slots.length - 1}`);
  }

  const doc = await PDFDocument.create();
  doc.setTitle('Labels');
  doc.setCreator('Combtrace');
  const [regular, bold] = await Promise.all([embedLora(doc, 400), embedLora(doc, 700)]);
  const fonts: LabelFonts = { regular, bold };
  const embedded = new Map<string, Promise<PDFImage>>();
  const forms = new Map<string, PDFRef>();
  const { widthPt, heightPt } = slots[0];

  // Plan every distinct label first, so a bad one fails before any drawing, and start
  // all its barcodes at once: their PNG compression runs while the rest is planned.
  const plans = new Map<string, LabelPlan>();
  const keys = labels.map((label, index) => {
    const key = JSON.stringify({ ...label, copies: 0 });
    if ((label.copies ?? 1) > 0 && !plans.has(key)) {
      try {
        const plan = planLabel(label, widthPt, heightPt, barcodeKind, fonts);
        plans.set(key, plan);
        for (const img of plan.images) embedImage(doc, img, embedded);
      } catch (error) {
        throw new Error(`Label ${index + 1} (${label.productName}, lot ${label.lotCode}): ${(error as Error).message}`);
      }
    }
    return key;
  });

  let page: PDFPage | null = null;
  let pageNames = new Map<PDFRef, PDFName>();
  let slotIndex = startSlot;
  for (const [index, label] of labels.entries()) {
    const copies = label.copies ?? 1;
    const plan = plans.get(keys[index]);
    if (copies === 0 || !plan) continue;
    let form = forms.get(keys[index]);
    if (!form) {
      form = await labelForm(doc, plan, widthPt, heightPt, fonts, embedded);
      forms.set(keys[index], form);
    }
    for (let copy = 0; copy < copies; copy++) {
      if (!page || slotIndex >= slots.length) {
        page = doc.addPage([pageWidthPt, pageHeightPt]);
        pageNames = new Map();
        if (slotIndex >= slots.length) slotIndex = 0;
      }
      let name = pageNames.get(form);
      if (!name) {
        name = page.node.newXObject('Label', form);
        pageNames.set(form, name);
      }
      const slot = slots[slotIndex];
      page.pushOperators(
        pushGraphicsState(),
        concatTransformationMatrix(1, 0, 0, 1, slot.xPt, slot.yPt),
        drawObject(name),
        popGraphicsState(),
      );
      slotIndex += 1;
    }
  }
  return doc.save();
}

/** Each distinct barcode is made and embedded once per document (pdf-lib embedPng). */
function embedImage(doc: PDFDocument, img: PlacedImage, embedded: Map<string, Promise<PDFImage>>): Promise<PDFImage> {
  let image = embedded.get(img.key);
  if (!image) {
    image = img.load().then((png) => doc.embedPng(png));
    image.catch(() => undefined); // awaited later; keep an early failure from being "unhandled"
    embedded.set(img.key, image);
  }
  return image;
}

const upright = { rotate: degrees(0), xSkew: degrees(0), ySkew: degrees(0) };

/**
 * One distinct label as a form XObject (ISO 32000-1 §8.10): drawn once, placed on
 * every copy. Its BBox clips it to the label, so nothing prints onto a neighbour.
 */
async function labelForm(
  doc: PDFDocument,
  plan: LabelPlan,
  width: number,
  height: number,
  fonts: LabelFonts,
  embedded: Map<string, Promise<PDFImage>>,
): Promise<PDFRef> {
  const fontNames = new Map<PDFFont, string>([
    [fonts.regular, 'F0'],
    [fonts.bold, 'F1'],
  ]);
  const operators: PDFOperator[] = [];
  for (const t of plan.texts) {
    operators.push(
      ...drawText(t.font.encodeText(t.text), {
        ...upright,
        color: INK,
        font: fontNames.get(t.font) ?? 'F0',
        size: t.size,
        x: t.x,
        y: t.y,
      }),
    );
  }
  const xObjects: Record<string, PDFRef> = {};
  for (const [i, img] of plan.images.entries()) {
    xObjects[`I${i}`] = (await embedImage(doc, img, embedded)).ref;
    operators.push(...drawImage(`I${i}`, { ...upright, x: img.x, y: img.y, width: img.width, height: img.height }));
  }
  const stream = doc.context.formXObject(operators, {
    BBox: [0, 0, width, height],
    Resources: { Font: { F0: fonts.regular.ref, F1: fonts.bold.ref }, XObject: xObjects },
  });
  return doc.context.register(stream);
}
