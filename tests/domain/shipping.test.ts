import { describe, expect, it } from 'vitest';
import { parcelWeightGrams, shippingCents } from '@/lib/domain/shipping';

// An owner's price list, deliberately out of order.
const bands = [
  { upToGrams: 5_000, cents: 1_290 },
  { upToGrams: 1_000, cents: 590 },
  { upToGrams: 2_000, cents: 790 },
];

describe('shippingCents', () => {
  it('picks the smallest band the parcel fits, edges inclusive', () => {
    expect(shippingCents(0, bands)).toBe(590);
    expect(shippingCents(1_000, bands)).toBe(590);
    expect(shippingCents(1_001, bands)).toBe(790);
    expect(shippingCents(2_000, bands)).toBe(790);
    expect(shippingCents(4_999, bands)).toBe(1_290);
  });

  it('returns null when heavier than every band or there are none', () => {
    expect(shippingCents(5_001, bands)).toBeNull();
    expect(shippingCents(100, [])).toBeNull();
  });

  it('rejects bad input', () => {
    expect(() => shippingCents(-1, bands)).toThrow(RangeError);
    expect(() => shippingCents(100, [{ upToGrams: 1_000, cents: 5.5 }])).toThrow(RangeError);
  });
});

describe('parcelWeightGrams', () => {
  it('adds net honey and containers per line', () => {
    const lines = [
      { quantity: 3, netGrams: 340, containerGrams: 210 },
      { quantity: 1, netGrams: 1_000, containerGrams: 420 },
      { quantity: 0, netGrams: 227, containerGrams: 160 },
    ];
    expect(parcelWeightGrams(lines)).toBe(3 * 550 + 1_420);
    expect(parcelWeightGrams([])).toBe(0);
  });

  it('rejects bad lines', () => {
    expect(() => parcelWeightGrams([{ quantity: 1.5, netGrams: 340, containerGrams: 200 }])).toThrow(RangeError);
    expect(() => parcelWeightGrams([{ quantity: 1, netGrams: -340, containerGrams: 200 }])).toThrow(RangeError);
  });
});
