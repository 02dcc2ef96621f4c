/**
 * Label sheet geometry, in millimetres in and PDF points out (ISO 32000-1 §8.3.2.3, from memory:
 * default user space unit 1/72 inch, origin bottom-left; 1 in = 25.4 mm exactly).
 */

export type LabelLayout = {
  name: string;
  paper: 'letter' | 'a4' | 'roll';
  labelWidthMm: number;
  labelHeightMm: number;
  columns: number;
  rows: number;
  marginTopMm: number;
  marginLeftMm: number;
  gapXMm: number;
  gapYMm: number;
  /** Printer calibration: positive moves every label right / down. */
  offsetXMm: number;
  offsetYMm: number;
};

export type LabelSlot = { xPt: number; yPt: number; widthPt: number; heightPt: number };

/** ISO 216 (A4 210 × 297 mm); ANSI/ASME Y14.1 (Letter 8.5 × 11 in = 215.9 × 279.4 mm). */
export const PAPER_SIZES_MM = {
  a4: { widthMm: 210, heightMm: 297 },
  letter: { widthMm: 215.9, heightMm: 279.4 },
} as const;

export function mmToPt(mm: number): number {
  return (mm * 72) / 25.4;
}

// Rounding slack when checking fit: printers cannot place to a hundredth of a millimetre.
const FIT_TOLERANCE_MM = 0.01;

/** Size of one page: the paper, or for a roll one label. */
function pageSizeMm(layout: LabelLayout): { widthMm: number; heightMm: number } {
  if (layout.paper === 'roll') return { widthMm: layout.labelWidthMm, heightMm: layout.labelHeightMm };
  return PAPER_SIZES_MM[layout.paper];
}

/** Errors that make a layout unusable; empty when it fits on its paper. */
export function validateLayout(layout: LabelLayout): string[] {
  const errors: string[] = [];
  const finite = (v: number) => Number.isFinite(v);
  if (!(layout.labelWidthMm > 0) || !(layout.labelHeightMm > 0))
    errors.push('Label width and height must be above 0 mm.');
  for (const key of ['marginTopMm', 'marginLeftMm', 'gapXMm', 'gapYMm', 'offsetXMm', 'offsetYMm'] as const) {
    if (!finite(layout[key])) errors.push(`${key} must be a number.`);
  }
  if (layout.paper === 'roll') return errors;
  if (!Number.isInteger(layout.columns) || layout.columns < 1)
    errors.push('Columns must be a whole number of at least 1.');
  if (!Number.isInteger(layout.rows) || layout.rows < 1) errors.push('Rows must be a whole number of at least 1.');
  if (layout.marginTopMm < 0 || layout.marginLeftMm < 0) errors.push('Margins cannot be negative.');
  if (layout.gapXMm < 0 || layout.gapYMm < 0) errors.push('Gaps cannot be negative.');
  if (errors.length > 0) return errors;

  const paper = PAPER_SIZES_MM[layout.paper];
  const left = layout.marginLeftMm + layout.offsetXMm;
  const top = layout.marginTopMm + layout.offsetYMm;
  const right = left + layout.columns * layout.labelWidthMm + (layout.columns - 1) * layout.gapXMm;
  const bottom = top + layout.rows * layout.labelHeightMm + (layout.rows - 1) * layout.gapYMm;
  if (left < -FIT_TOLERANCE_MM) errors.push('Labels start left of the paper edge (check margin and offset).');
  if (top < -FIT_TOLERANCE_MM) errors.push('Labels start above the paper edge (check margin and offset).');
  if (right > paper.widthMm + FIT_TOLERANCE_MM) {
    errors.push(
      `Labels are ${(right - paper.widthMm).toFixed(1)} mm too wide for ${layout.paper.toUpperCase()} paper.`,
    );
  }
  if (bottom > paper.heightMm + FIT_TOLERANCE_MM) {
    errors.push(
      `Labels are ${(bottom - paper.heightMm).toFixed(1)} mm too tall for ${layout.paper.toUpperCase()} paper.`,
    );
  }
  return errors;
}

/** Slots in reading order (left to right, top to bottom), in PDF points from the bottom-left. */
export function labelPositions(layout: LabelLayout): { pageWidthPt: number; pageHeightPt: number; slots: LabelSlot[] } {
  const page = pageSizeMm(layout);
  const pageHeightPt = mmToPt(page.heightMm);
  const widthPt = mmToPt(layout.labelWidthMm);
  const heightPt = mmToPt(layout.labelHeightMm);
  const columns = layout.paper === 'roll' ? 1 : layout.columns;
  const rows = layout.paper === 'roll' ? 1 : layout.rows;
  const left = layout.paper === 'roll' ? layout.offsetXMm : layout.marginLeftMm + layout.offsetXMm;
  const top = layout.paper === 'roll' ? layout.offsetYMm : layout.marginTopMm + layout.offsetYMm;
  const slots: LabelSlot[] = [];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < columns; c++) {
      const xMm = left + c * (layout.labelWidthMm + layout.gapXMm);
      const topMm = top + r * (layout.labelHeightMm + layout.gapYMm);
      slots.push({ xPt: mmToPt(xMm), yPt: pageHeightPt - mmToPt(topMm) - heightPt, widthPt, heightPt });
    }
  }
  return { pageWidthPt: mmToPt(page.widthMm), pageHeightPt, slots };
}

const base = { gapYMm: 0, offsetXMm: 0, offsetYMm: 0 };

/** Common generic sheet sizes (common practice; measure your own stock and adjust). */
export const BUILT_IN_LAYOUTS: readonly LabelLayout[] = [
  {
    ...base,
    name: 'A4 3×7 — 63.5 × 38.1 mm',
    paper: 'a4',
    labelWidthMm: 63.5,
    labelHeightMm: 38.1,
    columns: 3,
    rows: 7,
    marginTopMm: 15.15,
    marginLeftMm: 7.25,
    gapXMm: 2.5,
  },
  {
    ...base,
    name: 'A4 2×7 — 99.1 × 38.1 mm',
    paper: 'a4',
    labelWidthMm: 99.1,
    labelHeightMm: 38.1,
    columns: 2,
    rows: 7,
    marginTopMm: 15.15,
    marginLeftMm: 4.65,
    gapXMm: 2.5,
  },
  {
    ...base,
    name: 'Letter 3×10 — 66.7 × 25.4 mm',
    paper: 'letter',
    labelWidthMm: 66.675,
    labelHeightMm: 25.4,
    columns: 3,
    rows: 10,
    marginTopMm: 12.7,
    marginLeftMm: 4.7625,
    gapXMm: 3.175,
  },
  {
    ...base,
    name: 'Letter 2×5 — 101.6 × 50.8 mm',
    paper: 'letter',
    labelWidthMm: 101.6,
    labelHeightMm: 50.8,
    columns: 2,
    rows: 5,
    marginTopMm: 12.7,
    marginLeftMm: 3.96875,
    gapXMm: 4.7625,
  },
  {
    ...base,
    name: 'Roll 60 × 40 mm',
    paper: 'roll',
    labelWidthMm: 60,
    labelHeightMm: 40,
    columns: 1,
    rows: 1,
    marginTopMm: 0,
    marginLeftMm: 0,
    gapXMm: 0,
  },
];

/** A built-in layout by its name, or undefined. */
export function builtInLayout(name: string): LabelLayout | undefined {
  return BUILT_IN_LAYOUTS.find((layout) => layout.name === name);
}
