import { describe, expect, it } from 'vitest';
import {
  BUILT_IN_LAYOUTS,
  PAPER_SIZES_MM,
  builtInLayout,
  labelPositions,
  mmToPt,
  validateLayout,
} from '@/lib/domain/label-layout';
import type { LabelLayout } from '@/lib/domain/label-layout';

const a4x21 = BUILT_IN_LAYOUTS.find((l) => l.paper === 'a4' && l.columns === 3 && l.rows === 7) as LabelLayout;

describe('units and paper', () => {
  it('converts millimetres to points', () => {
    expect(mmToPt(25.4)).toBeCloseTo(72, 12); // ISO 32000-1 §8.3.2.3 (from memory): 1 unit = 1/72 in; 1 in = 25.4 mm exactly
  });
  it('knows A4 and Letter', () => {
    expect(PAPER_SIZES_MM.a4).toEqual({ widthMm: 210, heightMm: 297 }); // ISO 216
    expect(mmToPt(PAPER_SIZES_MM.letter.widthMm)).toBeCloseTo(612, 9); // Letter 8.5 × 11 in = 612 × 792 pt (ANSI)
    expect(mmToPt(PAPER_SIZES_MM.letter.heightMm)).toBeCloseTo(792, 9);
    expect(mmToPt(210)).toBeCloseTo(595.28, 2); // A4 in points (common practice)
  });
});

describe('built-in layouts', () => {
  it('all fit their paper and have the expected label counts', () => {
    for (const layout of BUILT_IN_LAYOUTS) expect(validateLayout(layout), layout.name).toEqual([]);
    expect(BUILT_IN_LAYOUTS.map((l) => labelPositions(l).slots.length)).toEqual([21, 14, 30, 10, 1]);
  });
  it('includes the generic sizes: A4 3 × 7, Letter 3 × 10, a 60 × 40 mm roll', () => {
    expect(a4x21).toMatchObject({ labelWidthMm: 63.5, labelHeightMm: 38.1 });
    expect(
      BUILT_IN_LAYOUTS.some((l) => l.paper === 'letter' && l.columns * l.rows === 30 && l.labelHeightMm === 25.4),
    ).toBe(true);
    expect(BUILT_IN_LAYOUTS.some((l) => l.paper === 'roll' && l.labelWidthMm === 60 && l.labelHeightMm === 40)).toBe(
      true,
    );
    expect(builtInLayout(a4x21.name)).toBe(a4x21);
    expect(builtInLayout('no such')).toBeUndefined();
  });
  it('never overlaps two labels or leaves the page', () => {
    for (const layout of BUILT_IN_LAYOUTS) {
      const { pageWidthPt, pageHeightPt, slots } = labelPositions(layout);
      for (const [i, a] of slots.entries()) {
        expect(a.xPt).toBeGreaterThanOrEqual(-1e-9);
        expect(a.yPt).toBeGreaterThanOrEqual(-1e-9);
        expect(a.xPt + a.widthPt).toBeLessThanOrEqual(pageWidthPt + 1e-6);
        expect(a.yPt + a.heightPt).toBeLessThanOrEqual(pageHeightPt + 1e-6);
        for (const b of slots.slice(i + 1)) {
          const apart =
            a.xPt + a.widthPt <= b.xPt + 1e-6 ||
            b.xPt + b.widthPt <= a.xPt + 1e-6 ||
            a.yPt + a.heightPt <= b.yPt + 1e-6 ||
            b.yPt + b.heightPt <= a.yPt + 1e-6;
          expect(apart).toBe(true);
        }
      }
    }
  });
});

describe('labelPositions', () => {
  it('places slots in reading order from the top-left, origin bottom-left', () => {
    const { pageHeightPt, slots } = labelPositions(a4x21);
    expect(slots[0].xPt).toBeCloseTo(mmToPt(a4x21.marginLeftMm), 9);
    expect(slots[0].yPt).toBeCloseTo(pageHeightPt - mmToPt(a4x21.marginTopMm + 38.1), 9);
    expect(slots[1].xPt).toBeCloseTo(mmToPt(a4x21.marginLeftMm + 63.5 + a4x21.gapXMm), 9);
    expect(slots[3].yPt).toBeLessThan(slots[0].yPt);
    expect(slots[0].widthPt).toBeCloseTo(mmToPt(63.5), 9);
  });
  it('shifts every label by the calibration offset (right and down)', () => {
    const base = labelPositions(a4x21).slots[4];
    const moved = labelPositions({ ...a4x21, offsetXMm: 1, offsetYMm: 2 }).slots[4];
    expect(moved.xPt - base.xPt).toBeCloseTo(mmToPt(1), 9);
    expect(base.yPt - moved.yPt).toBeCloseTo(mmToPt(2), 9);
  });
  it('makes a roll page the size of one label', () => {
    const roll: LabelLayout = {
      ...a4x21,
      name: 'roll',
      paper: 'roll',
      labelWidthMm: 60,
      labelHeightMm: 40,
      columns: 3,
      rows: 7,
    };
    const { pageWidthPt, pageHeightPt, slots } = labelPositions(roll);
    expect(pageWidthPt).toBeCloseTo(mmToPt(60), 9);
    expect(pageHeightPt).toBeCloseTo(mmToPt(40), 9);
    expect(slots).toEqual([{ xPt: 0, yPt: 0, widthPt: pageWidthPt, heightPt: pageHeightPt }]);
  });
});

describe('validateLayout', () => {
  it('reports labels wider or taller than the paper', () => {
    expect(validateLayout({ ...a4x21, columns: 4 }).join(' ')).toMatch(/too wide/);
    expect(validateLayout({ ...a4x21, rows: 8 }).join(' ')).toMatch(/too tall/);
    expect(validateLayout({ ...a4x21, offsetXMm: 10 }).join(' ')).toMatch(/too wide/);
    expect(validateLayout({ ...a4x21, offsetYMm: -20 }).join(' ')).toMatch(/above the paper/);
  });
  it('reports impossible numbers', () => {
    expect(validateLayout({ ...a4x21, columns: 0 })).not.toEqual([]);
    expect(validateLayout({ ...a4x21, rows: 2.5 })).not.toEqual([]);
    expect(validateLayout({ ...a4x21, labelWidthMm: 0 })).not.toEqual([]);
    expect(validateLayout({ ...a4x21, gapXMm: -1 })).not.toEqual([]);
    expect(validateLayout({ ...a4x21, marginTopMm: Number.NaN })).not.toEqual([]);
  });
  it('accepts a layout that fills the paper exactly', () => {
    // 3 × 70 mm = 210 mm, A4's width (ISO 216)
    expect(validateLayout({ ...a4x21, labelWidthMm: 70, marginLeftMm: 0, gapXMm: 0 })).toEqual([]);
  });
});
