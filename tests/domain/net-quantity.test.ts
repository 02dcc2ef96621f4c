import { describe, expect, it } from 'vitest';
import { declareNetQuantity, declareNetWeightMetric, declareNetWeightUS } from '@/lib/domain/net-quantity';

const OZ = 28.349523125; // 1 oz = 28.349523125 g exactly (international yard and pound agreement, 1959)

describe('US dual declaration', () => {
  it("matches FDA's example for 24 oz", () => {
    // FDA Food Labeling Guide: "Net wt 1 lb 8 oz (680g)"
    expect(declareNetWeightUS(24)).toBe('NET WT 1 LB 8 OZ (680 g)');
  });
  it('rounds the metric figure down, never up (NIST Handbook 130)', () => {
    expect(declareNetWeightUS(12)).toBe('NET WT 12 OZ (340 g)'); // 340.19 g → 340 g (NIST HB 130, round down)
    expect(declareNetWeightUS(8)).toBe('NET WT 8 OZ (226 g)'); // 226.80 g → 226 g, not 227 (NIST HB 130)
    expect(declareNetWeightUS(16)).toBe('NET WT 1 LB (453 g)'); // 453.59 g → 453 g, not 454 (NIST HB 130)
    expect(declareNetWeightUS(32)).toBe('NET WT 2 LB (907 g)'); // 907.18 g → 907 g (NIST HB 130)
  });
  it('uses pounds and ounces from 1 lb up (16 CFR 500.19; FDA example above)', () => {
    expect(declareNetWeightUS(17)).toBe('NET WT 1 LB 1 OZ (481 g)'); // 481.94 g → 481 g
    expect(declareNetWeightUS(80)).toBe('NET WT 5 LB (2.26 kg)'); // 2267.96 g → 3 significant figures, down
    expect(declareNetWeightUS(40)).toBe('NET WT 2 LB 8 OZ (1.13 kg)'); // 1133.98 g → 1.13 kg
  });
  it('keeps two significant figures below 100 g (NIST Handbook 130)', () => {
    expect(declareNetWeightUS(1.5)).toBe('NET WT 1.5 OZ (42 g)'); // 42.52 g → 42 g
    expect(declareNetWeightUS(2)).toBe('NET WT 2 OZ (56 g)'); // 56.70 g → 56 g
    expect(declareNetWeightUS(3.5)).toBe('NET WT 3.5 OZ (99 g)'); // 99.22 g → 99 g
  });
  it('floors fractional ounces to hundredths', () => {
    expect(declareNetWeightUS(24.999)).toBe('NET WT 1 LB 8.99 OZ (708 g)');
    expect(declareNetWeightUS(2.25)).toBe('NET WT 2.25 OZ (63 g)');
  });
  it('never overstates and loses less than one step of the last figure, 0.25 to 100 oz', () => {
    for (let quarter = 1; quarter <= 400; quarter++) {
      const ounces = quarter / 4;
      const exact = ounces * OZ;
      const metric = /\(([\d.]+) (g|kg)\)$/.exec(declareNetWeightUS(ounces));
      expect(metric).not.toBeNull();
      const grams = Number(metric?.[1]) * (metric?.[2] === 'kg' ? 1000 : 1);
      expect(grams).toBeLessThanOrEqual(exact + 1e-9);
      // NIST Handbook 130: two significant figures below 100 g, three from 100 g
      const step = exact < 10 ? 0.1 : exact < 100 ? 1 : 10 ** (Math.floor(Math.log10(exact)) - 2);
      expect(grams).toBeGreaterThan(exact - step);
    }
  });
  it('refuses zero, negative and non-finite amounts', () => {
    expect(() => declareNetWeightUS(0)).toThrow();
    expect(() => declareNetWeightUS(-1)).toThrow();
    expect(() => declareNetWeightUS(Number.NaN)).toThrow();
  });
});

describe('metric declaration (Regulation (EU) 1169/2011, Annex IX: g or kg)', () => {
  it('uses g below 1 kg and kg from 1 kg', () => {
    expect(declareNetWeightMetric(340)).toBe('340 g');
    expect(declareNetWeightMetric(999)).toBe('999 g');
    expect(declareNetWeightMetric(1000)).toBe('1 kg');
    expect(declareNetWeightMetric(1500)).toBe('1.5 kg');
    expect(declareNetWeightMetric(1250)).toBe('1.25 kg');
  });
  it('rounds down fractions of a gram', () => {
    expect(declareNetWeightMetric(42.57)).toBe('42.5 g');
    expect(() => declareNetWeightMetric(0)).toThrow();
  });
});

describe('declaration for a product', () => {
  it('declares an ounce product in both modes', () => {
    const jar = { netGrams: 340, declaredUnit: 'oz' as const, declaredAmount: 12 };
    expect(declareNetQuantity(jar, 'us-dual')).toBe('NET WT 12 OZ (340 g)'); // as declareNetWeightUS(12)
    expect(declareNetQuantity(jar, 'metric')).toBe('340 g');
  });
  it('declares a gram product: exact grams, ounces rounded down to 3 significant figures', () => {
    const jar = { netGrams: 500, declaredUnit: 'g' as const, declaredAmount: 500 };
    expect(declareNetQuantity(jar, 'metric')).toBe('500 g');
    expect(declareNetQuantity(jar, 'us-dual')).toBe('NET WT 1 LB 1.6 OZ (500 g)'); // 17.637 oz → 17.6
    expect(declareNetQuantity({ netGrams: 340, declaredUnit: 'g', declaredAmount: 340 }, 'us-dual')).toBe(
      'NET WT 11.9 OZ (340 g)',
    ); // 11.99 → 11.9
  });
  // NIST Handbook 130 (metric figure in three significant figures, never overstating) and
  // 16 CFR 500.19 (dual declaration): a kilogram figure is rounded like every other figure.
  it('US dual, gram product of 1 kg or more: kg in three significant figures, rounded down', () => {
    const big = (g: number) => ({ netGrams: g, declaredUnit: 'g' as const, declaredAmount: g });
    expect(declareNetQuantity(big(1361), 'us-dual')).toBe('NET WT 3 LB (1.36 kg)'); // 48.007 oz → 48.0
    expect(declareNetQuantity(big(1000), 'us-dual')).toBe('NET WT 2 LB 3.2 OZ (1 kg)'); // 35.27 oz → 35.2
    expect(declareNetQuantity(big(2999), 'us-dual')).toBe('NET WT 6 LB 9 OZ (2.99 kg)'); // 105.78 oz → 105
  });
});
