import 'server-only';
import { getDb } from '@/lib/db/index';
import { appUrl } from '@/lib/config/app-url';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { declareNetQuantity } from '@/lib/domain/net-quantity';
import { labelPositions } from '@/lib/domain/label-layout';
import { renderLabelSheet } from '@/lib/pdf/labels';
import type { LabelContent } from '@/lib/pdf/label-content';
import { getSettings } from '@/lib/data/settings/settings';
import { getLabelLayout } from './layouts';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
/** "2027-12-31" → "31 Dec 2027": day, month word, year — unambiguous on both sides of the Atlantic. */
function printedDate(iso: string): string {
  const [y, m, d] = iso.split('-').map(Number);
  return `${d} ${MONTHS[m - 1]} ${y}`;
}

/** What one jar label of a run says. */
async function runLabelContent(
  runId: number,
): Promise<{ content: LabelContent; jarCount: number; lotCode: string; productName: string }> {
  const { JarringRun, Lot, Product } = getDb().models;
  const run = await JarringRun.findByPk(runId);
  if (!run) throw new NotFoundError('No such jarring run.');
  const [lot, product, settings] = await Promise.all([
    Lot.findByPk(run.lotId),
    Product.findByPk(run.productId),
    getSettings(),
  ]);
  if (!lot || !product) throw new NotFoundError('The run’s lot or product is missing.');
  if (!product.gtin)
    throw new ConflictError(`${product.name} has no GTIN yet: add one on the product page before printing labels.`);
  if (!lot.bestBeforeOn) throw new ConflictError(`Lot ${lot.code} has no best-before date.`);
  const content: LabelContent = {
    productName: product.name,
    floralSource: lot.floralSource,
    netQuantity: declareNetQuantity(
      {
        netGrams: product.netGrams,
        declaredUnit: product.declaredUnit,
        declaredAmount: Number(product.declaredAmount),
      },
      settings.labelDeclaration,
    ),
    businessName: settings.businessName,
    businessAddress: settings.address,
    lotCode: lot.code,
    bestBefore: lot.bestBeforeOn,
    bestBeforeText: printedDate(lot.bestBeforeOn),
    gtin: product.gtin,
    publicUrl: `${appUrl()}/lot/${encodeURIComponent(lot.code)}`,
  };
  return { content, jarCount: run.jarCount, lotCode: lot.code, productName: product.name };
}

/**
 * The PDF of a run's labels: one per jar (or `copies`), from `startSlot` on the first sheet.
 * `firstPageOnly` renders just what fits on page one, for the print preview.
 */
export async function renderRunLabels(
  runId: number,
  opts: { layoutKey?: string | null; startSlot?: number; copies?: number; firstPageOnly?: boolean } = {},
): Promise<{ bytes: Uint8Array; filename: string }> {
  const [{ content, jarCount, lotCode, productName }, layout, settings] = await Promise.all([
    runLabelContent(runId),
    getLabelLayout(opts.layoutKey),
    getSettings(),
  ]);
  const slots = labelPositions(layout).slots.length;
  const startSlot = layout.paper === 'roll' ? 0 : Math.min(Math.max(opts.startSlot ?? 0, 0), slots - 1);
  let copies = opts.copies ?? jarCount;
  if (opts.firstPageOnly) copies = Math.min(copies, layout.paper === 'roll' ? 1 : slots - startSlot);
  try {
    const bytes = await renderLabelSheet({
      layout,
      labels: [{ ...content, copies }],
      barcodeKind: settings.barcodeKind,
      startSlot,
    });
    return { bytes, filename: `labels-${lotCode}-${productName}-run-${runId}` };
  } catch (err) {
    // Content the label cannot carry (a lot code outside GS1's characters, too many labels …) is the user's to fix.
    if (err instanceof RangeError || (err instanceof Error && /^Label \d|layout/i.test(err.message)))
      throw new InvalidError(err.message);
    throw err;
  }
}
