import { describe, expect, it } from 'vitest';
import {
  GRAMS_PER_OUNCE,
  GRAMS_PER_POUND,
  formatMoney,
  formatWeight,
  gramsToKg,
  gramsToLb,
  gramsToOz,
  kgToGrams,
  lbToGrams,
  ozToGrams,
  toGrams,
} from '@/lib/domain/units';

describe('exact factors', () => {
  it('uses the defined pound and ounce', () => {
    expect(GRAMS_PER_POUND).toBe(453.59237); // 1 lb = 453.59237 g exactly (international yard and pound agreement, 1959)
    expect(GRAMS_PER_OUNCE).toBe(28.349523125); // 1 oz = 1/16 lb = 28.349523125 g exactly (same agreement)
    expect(GRAMS_PER_OUNCE * 16).toBeCloseTo(GRAMS_PER_POUND, 12); // 16 oz = 1 lb avoirdupois
  });
});

describe('to grams (rounded)', () => {
  it('converts and rounds to whole grams', () => {
    expect(kgToGrams(12.3456)).toBe(12346);
    expect(lbToGrams(1)).toBe(454); // 453.59237 rounds to 454
    expect(lbToGrams(1.5)).toBe(680); // FDA Food Labeling Guide example: "Net wt 1 lb 8 oz (680g)"
    expect(ozToGrams(24)).toBe(680); // same FDA example, 24 oz
    expect(ozToGrams(4)).toBe(113); // NIST Handbook 133 example: 113 g (¼ lb)
  });

  it('dispatches by unit', () => {
    expect(toGrams(2, 'kg')).toBe(kgToGrams(2));
    expect(toGrams(3, 'lb')).toBe(lbToGrams(3));
    expect(toGrams(12, 'oz')).toBe(ozToGrams(12));
    expect(toGrams(340.4, 'g')).toBe(340);
  });

  it('refuses non-numbers', () => {
    expect(() => kgToGrams(Number.NaN)).toThrow(RangeError);
    expect(() => toGrams(Number.POSITIVE_INFINITY, 'g')).toThrow(RangeError);
  });
});

describe('from grams (unrounded)', () => {
  it('round-trips with the exact factors', () => {
    expect(gramsToKg(12345)).toBe(12.345);
    expect(gramsToLb(GRAMS_PER_POUND * 3)).toBeCloseTo(3, 12);
    expect(gramsToOz(GRAMS_PER_OUNCE * 7)).toBeCloseTo(7, 12);
    expect(gramsToLb(1000)).toBeCloseTo(1000 / GRAMS_PER_POUND, 12);
  });
});

describe('formatWeight', () => {
  it('shows jars and drums in metric', () => {
    expect(formatWeight(340, 'metric')).toBe('340 g');
    expect(formatWeight(999.6, 'metric')).toBe('1.00 kg');
    expect(formatWeight(12345, 'metric')).toBe('12.35 kg');
    expect(formatWeight(300000, 'metric')).toBe('300.00 kg');
  });

  it('shows jars and drums in US units', () => {
    expect(formatWeight(340, 'us')).toBe('12 oz'); // 11.99 oz to 0.1
    expect(formatWeight(250, 'us')).toBe('8.8 oz');
    expect(formatWeight(680, 'us')).toBe('1 lb 8 oz'); // FDA Food Labeling Guide example "1 lb 8 oz (680g)"
    expect(formatWeight(lbToGrams(27) + ozToGrams(3), 'us')).toBe('27 lb 3 oz');
    expect(formatWeight(lbToGrams(60), 'us')).toBe('60 lb');
    expect(formatWeight(454, 'us')).toBe('1 lb');
  });

  it('keeps the sign of a negative adjustment', () => {
    expect(formatWeight(-340, 'metric')).toBe('-340 g');
    expect(formatWeight(-680, 'us')).toBe('-1 lb 8 oz');
  });
});

describe('formatMoney', () => {
  it('formats minor units with Intl', () => {
    expect(formatMoney(1299, 'USD')).toBe('$12.99');
    expect(formatMoney(1299, 'EUR', 'de-DE')).toMatch(/^12,99\s€$/);
    expect(formatMoney(1299, 'JPY')).toBe('¥1,299'); // JPY has no minor unit (ISO 4217)
    expect(formatMoney(0, 'USD')).toBe('$0.00');
  });

  it('refuses fractional cents', () => {
    expect(() => formatMoney(12.5, 'USD')).toThrow(RangeError);
  });
});
