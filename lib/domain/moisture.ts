/**
 * Water content of honey (g/100 g, "% water") from a refractometer.
 * Wedmore (1955) revision of the Chataway (1932) table, AOAC Official Method 969.38 B
 * and the International Honey Commission's Harmonised methods:
 *   W = (−0.2681 − log10(nD20 − 1)) / 0.002243
 * Temperature: a reading above 20 °C is corrected by +0.00023 per °C, below by −0.00023 per °C.
 * Limits: EU Council Directive 2001/110/EC Annex II (≤ 20 %, heather ≤ 23 %);
 * USDA U.S. Standards for Grades of Extracted Honey (1985): Grade A and B ≤ 18.6 %.
 * Fermentation risk: USDA Agriculture Handbook 335, after Lochhead.
 */

export const DEFAULT_MOISTURE_LIMITS = { generalPct: 20, heatherPct: 23, gradeAPct: 18.6 };
export type MoistureLimits = { generalPct: number; heatherPct: number; gradeAPct: number };

const RI_PER_DEGREE = 0.00023;
const MIN_HONEY_RI = 1.47; // ≈ 26.7 % water: wetter than any honey a refractometer should see
const MAX_HONEY_RI = 1.51; // ≈ 10.8 % water
const MIN_TEMP_C = 5;
const MAX_TEMP_C = 45;
// Comparisons allow for floating-point noise only, not for measurement error.
const EPS = 1e-9;

function correctedTo20(refractiveIndex: number, temperatureC: number): number {
  if (!Number.isFinite(refractiveIndex)) throw new RangeError('Refractive index must be a finite number');
  if (!Number.isFinite(temperatureC) || temperatureC < MIN_TEMP_C || temperatureC > MAX_TEMP_C) {
    throw new RangeError(`Temperature ${temperatureC} °C is outside ${MIN_TEMP_C}–${MAX_TEMP_C} °C`);
  }
  const nD20 = refractiveIndex + RI_PER_DEGREE * (temperatureC - 20);
  if (nD20 < MIN_HONEY_RI || nD20 > MAX_HONEY_RI) {
    throw new RangeError(
      `Refractive index ${nD20.toFixed(4)} at 20 °C is not a honey reading (${MIN_HONEY_RI}–${MAX_HONEY_RI})`,
    );
  }
  return nD20;
}

/** % water (unrounded) from a refractive index read at temperatureC (default 20 °C). */
export function waterFromRefractiveIndex(refractiveIndex: number, temperatureC = 20): number {
  const nD20 = correctedTo20(refractiveIndex, temperatureC);
  return (-0.2681 - Math.log10(nD20 - 1)) / 0.002243;
}

/** Refractive index at 20 °C for a % water (inverse Wedmore formula). */
export function refractiveIndexFromWater(waterPct: number): number {
  if (!Number.isFinite(waterPct)) throw new RangeError('Water content must be a finite number');
  return 1 + 10 ** (-0.2681 - 0.002243 * waterPct);
}

/**
 * % water from a honey refractometer's own % water scale. Without a temperature the
 * instrument is taken as compensated (or read at 20 °C). With one, the scale reading
 * is turned back into its refractive index, corrected to 20 °C and converted again.
 */
export function waterFromScaleReading(waterPct: number, temperatureC?: number): number {
  const water = waterFromRefractiveIndex(refractiveIndexFromWater(waterPct), temperatureC ?? 20);
  return temperatureC === undefined ? waterPct : water;
}

/** Highest and mean of several readings on one lot; null when there are none. */
export function moistureSummary(values: number[]): { highest: number; mean: number; count: number } | null {
  if (values.length === 0) return null;
  if (values.some((v) => !Number.isFinite(v))) throw new RangeError('Moisture readings must be finite numbers');
  const sum = values.reduce((a, b) => a + b, 0);
  return { highest: Math.max(...values), mean: sum / values.length, count: values.length };
}

/**
 * The water content a decision is made on: the value rounded (half up) to the display precision
 * of 0.1 %, as a honey refractometer reads it. So the figure shown and the verdict never disagree:
 * RI 1.4864 (20.02 %) shows "20 %" and is within a 20 % limit; 20.05 % shows 20.1 % and is over.
 */
export function decisionPct(waterPct: number): number {
  if (!Number.isFinite(waterPct)) throw new RangeError('Water content must be a finite number');
  return Math.round(waterPct * 10 + EPS) / 10;
}

function pct(value: number): string {
  return `${Number(value.toFixed(1))} %`;
}

/** A reading against the owner's limits (defaults: DEFAULT_MOISTURE_LIMITS). */
export function gradeMoisture(
  waterPct: number,
  limits: MoistureLimits,
  opts: { heather?: boolean } = {},
): { withinLimit: boolean; limitPct: number; usGradeAB: boolean; label: string } {
  if (!Number.isFinite(waterPct)) throw new RangeError('Water content must be a finite number');
  const limitPct = opts.heather ? limits.heatherPct : limits.generalPct;
  const water = decisionPct(waterPct);
  const withinLimit = water <= limitPct + EPS;
  const usGradeAB = water <= limits.gradeAPct + EPS;
  const limitText = `${opts.heather ? 'heather ' : ''}limit of ${pct(limitPct)}`;
  // Water is one factor of a USDA grade, not the grade: say only that the water is within its limit.
  const label = withinLimit
    ? `${pct(water)} water: within the ${limitText}${usGradeAB ? `; water within the US Grade A limit (≤ ${pct(limits.gradeAPct)})` : ''}`
    : `${pct(water)} water: over the ${limitText}`;
  return { withinLimit, limitPct, usGradeAB, label };
}

export type FermentationBand = 'low' | 'yeast-dependent' | 'high-yeast-dependent' | 'likely';

/**
 * Fermentation risk bands (USDA Agriculture Handbook 335 after Lochhead; treated as
 * common practice): below 17.1 % low; up to 18.0 % safe if yeast ≤ 1000/g; up to
 * 19.0 % safe only if yeast ≤ 10/g; above 19 % likely. The table is in 0.1 % steps and
 * is read, like the limits, on the value rounded to 0.1 % (decisionPct): 18.05 → 18.1 %, 18.04 → 18.0 %.
 */
export function fermentationRisk(rawPct: number): { band: FermentationBand; label: string } {
  const waterPct = decisionPct(rawPct);
  if (waterPct < 17.1 - EPS) return { band: 'low', label: 'Low risk: keeps a year whatever the yeast count' };
  if (waterPct <= 18.0 + EPS) return { band: 'yeast-dependent', label: 'Safe only if yeast count ≤ 1000/g' };
  if (waterPct <= 19.0 + EPS) return { band: 'high-yeast-dependent', label: 'Safe only if yeast count ≤ 10/g' };
  return { band: 'likely', label: 'Likely to ferment' };
}
