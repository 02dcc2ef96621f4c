/**
 * Net quantity declarations for honey (sold by weight).
 * US: dual units, "NET WT …" (Fair Packaging and Labeling Act; 16 CFR 500.19; FDA Food
 * Labeling Guide, example "Net wt 1 lb 8 oz (680g)"). The metric figure has three
 * significant figures (two below 100 g) and is rounded down so it never overstates
 * the contents (NIST Handbook 130). EU: g below 1 kg, kg from 1 kg (Regulation (EU)
 * 1169/2011, Annex IX).
 */
import { GRAMS_PER_OUNCE } from './units';

// Guards floor() against binary fractions such as 679.99999999997 for an exact 680.
const EPS = 1 + 1e-12;

function positive(value: number, what: string): number {
  if (!Number.isFinite(value) || value <= 0) throw new RangeError(`${what} must be a positive number`);
  return value;
}

/** Rounds down to `digits` significant figures; returns the value and its decimals. */
function floorSignificant(value: number, digits: number): { value: number; decimals: number } {
  const lastPlace = Math.floor(Math.log10(value)) - digits + 1;
  if (lastPlace >= 0) {
    const step = 10 ** lastPlace;
    return { value: Math.floor((value / step) * EPS) * step, decimals: 0 };
  }
  const scale = 10 ** -lastPlace;
  return { value: Math.floor(value * scale * EPS) / scale, decimals: -lastPlace };
}

function floorDecimals(value: number, decimals: number): number {
  const scale = 10 ** decimals;
  return Math.floor(value * scale * EPS) / scale;
}

/** Trims trailing zeros: 1.50 → "1.5", 2.000 → "2". */
function plain(value: number, decimals: number): string {
  const fixed = value.toFixed(decimals);
  return fixed.includes('.') ? fixed.replace(/\.?0+$/, '') : fixed;
}

function metricFigure(grams: number): { value: number; decimals: number } {
  return floorSignificant(grams, grams < 100 ? 2 : 3);
}

/** Metric figure for a US declaration: 3 significant figures (2 below 100 g), rounded down (NIST HB 130). */
function usMetricFigure(grams: number): string {
  const { value, decimals } = metricFigure(grams);
  if (value >= 1000) return `${plain(value / 1000, 3)} kg`;
  return `${plain(value, decimals)} g`;
}

/** Ounces (floored to 0.01 oz) as "12 OZ", "1 LB", "1 LB 8 OZ", "1.5 OZ" (16 CFR 500.19; FDA example). */
function usCustomaryPart(ounces: number): string {
  const total = floorDecimals(ounces, 2);
  if (total < 16) return `${plain(total, 2)} OZ`;
  const pounds = Math.floor(total / 16);
  const rest = floorDecimals(total - pounds * 16, 2);
  return rest > 0 ? `${pounds} LB ${plain(rest, 2)} OZ` : `${pounds} LB`;
}

/** "NET WT 12 OZ (340 g)", "NET WT 1 LB 8 OZ (680 g)"; 1 oz = 28.349523125 g exactly. */
export function declareNetWeightUS(ounces: number): string {
  positive(ounces, 'Net weight');
  return `NET WT ${usCustomaryPart(ounces)} (${usMetricFigure(ounces * GRAMS_PER_OUNCE)})`;
}

/** "340 g", "1 kg", "1.5 kg" (Regulation (EU) 1169/2011, Annex IX: g or kg); rounded down. */
export function declareNetWeightMetric(grams: number): string {
  positive(grams, 'Net weight');
  if (grams >= 1000) return `${plain(floorDecimals(grams / 1000, 3), 3)} kg`;
  return `${plain(floorDecimals(grams, 1), 1)} g`;
}

export type NetQuantityProduct = { netGrams: number; declaredUnit: 'g' | 'oz'; declaredAmount: number };

/**
 * The declaration printed on a product's label. The declared amount and unit are the
 * product's own (the figure it was filled to); the other unit is converted and rounded
 * down. `netGrams` is the stored weight and is not used for the wording.
 */
export function declareNetQuantity(product: NetQuantityProduct, mode: 'us-dual' | 'metric'): string {
  const amount = positive(product.declaredAmount, 'Declared amount');
  if (mode === 'us-dual') {
    if (product.declaredUnit === 'oz') return declareNetWeightUS(amount);
    // Declared in grams: ounces and the metric figure both in 3 significant figures, rounded down
    // (1361 g → "1.36 kg", not "1.361 kg"); a whole-gram amount under 1 kg stays as declared.
    const ounces = floorSignificant(amount / GRAMS_PER_OUNCE, 3).value;
    return `NET WT ${usCustomaryPart(ounces)} (${usMetricFigure(amount)})`;
  }
  if (product.declaredUnit === 'g') return declareNetWeightMetric(amount);
  return declareNetWeightMetric(metricFigure(amount * GRAMS_PER_OUNCE).value);
}
