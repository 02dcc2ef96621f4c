/**
 * Weight and money units. Weights are stored as integer grams, money as integer
 * minor units (cents). Exact factors: 1 lb = 453.59237 g (international yard and
 * pound agreement, 1959); 1 oz = 1/16 lb = 28.349523125 g.
 */

export const GRAMS_PER_POUND = 453.59237;
export const GRAMS_PER_OUNCE = 28.349523125;

export type WeightUnit = 'kg' | 'lb' | 'g' | 'oz';
export type UnitSystem = 'metric' | 'us';

function finite(value: number, what: string): number {
  if (!Number.isFinite(value)) throw new RangeError(`${what} must be a finite number`);
  return value;
}

/** Kilograms to whole grams (Math.round, the one conversion point). */
export function kgToGrams(kg: number): number {
  return Math.round(finite(kg, 'Weight') * 1000);
}

/** Pounds (avoirdupois) to whole grams. */
export function lbToGrams(lb: number): number {
  return Math.round(finite(lb, 'Weight') * GRAMS_PER_POUND);
}

/** Ounces (avoirdupois) to whole grams. */
export function ozToGrams(oz: number): number {
  return Math.round(finite(oz, 'Weight') * GRAMS_PER_OUNCE);
}

/** Grams to kilograms, unrounded. */
export function gramsToKg(grams: number): number {
  return grams / 1000;
}

/** Grams to pounds, unrounded. */
export function gramsToLb(grams: number): number {
  return grams / GRAMS_PER_POUND;
}

/** Grams to ounces, unrounded. */
export function gramsToOz(grams: number): number {
  return grams / GRAMS_PER_OUNCE;
}

/** Any supported unit to whole grams (rounded, as stored). */
export function toGrams(value: number, unit: WeightUnit): number {
  switch (unit) {
    case 'kg':
      return kgToGrams(value);
    case 'lb':
      return lbToGrams(value);
    case 'oz':
      return ozToGrams(value);
    case 'g':
      return Math.round(finite(value, 'Weight'));
  }
}

function trimZero(text: string): string {
  return text.replace(/\.0+$/, '');
}

/**
 * A weight for screens (not for label net-quantity declarations, which must round
 * down — NIST Handbook 130; those are done by the label code).
 * Metric: under 1 kg in whole grams ("340 g"), from 1 kg in kg to 0.01 ("12.35 kg").
 * US: under 1 lb in ounces to 0.1 ("8.8 oz", "12 oz"); from 1 lb as pounds and
 * whole ounces, rounded to the nearest ounce ("1 lb 8 oz", "661 lb 6 oz", "27 lb").
 */
export function formatWeight(grams: number, system: UnitSystem): string {
  finite(grams, 'Weight');
  const sign = grams < 0 ? '-' : '';
  const g = Math.abs(grams);
  if (system === 'metric') {
    if (Math.round(g) < 1000) return `${sign}${Math.round(g)} g`;
    return `${sign}${(g / 1000).toFixed(2)} kg`;
  }
  const ounces = gramsToOz(g);
  if (Math.round(ounces * 10) / 10 < 16) return `${sign}${trimZero(ounces.toFixed(1))} oz`;
  const wholeOunces = Math.round(ounces);
  const lb = Math.floor(wholeOunces / 16);
  const oz = wholeOunces % 16;
  return oz === 0 ? `${sign}${lb} lb` : `${sign}${lb} lb ${oz} oz`;
}

// Building an Intl.NumberFormat is far slower than using one (it showed up in the catalogue's CPU
// profile), so each locale/currency pair is built once per process.
const moneyFormats = new Map<string, Intl.NumberFormat>();
function moneyFormat(locale: string, currency: string): Intl.NumberFormat {
  const key = `${locale}|${currency.toUpperCase()}`;
  let format = moneyFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(locale, { style: 'currency', currency: currency.toUpperCase() });
    moneyFormats.set(key, format);
  }
  return format;
}

/** Digits of a currency's minor unit, from Intl's currency data (2 for USD/EUR, 0 for JPY). */
export function currencyMinorDigits(currency: string): number {
  return moneyFormat('en', currency).resolvedOptions().maximumFractionDigits ?? 2;
}

/**
 * Money from integer minor units, formatted by Intl. The number of minor-unit
 * digits is taken from Intl for the currency (2 for USD/EUR, 0 for JPY).
 */
export function formatMoney(cents: number, currency: string, locale = 'en-US'): string {
  if (!Number.isInteger(cents)) throw new RangeError('Money must be an integer number of minor units');
  return moneyFormat(locale, currency).format(cents / 10 ** currencyMinorDigits(currency));
}
