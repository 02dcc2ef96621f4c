/**
 * Parcel weight and shipping price by weight band. Weights in grams, prices in
 * cents. Bands are the owner's price list: each covers parcels up to and including
 * `upToGrams`; the cheapest fitting band is the one with the smallest limit.
 */

export type ShippingBand = { upToGrams: number; cents: number };
export type ParcelLine = { quantity: number; netGrams: number; containerGrams: number };

/** Price of the smallest band the parcel fits in; null when it is heavier than every band. */
export function shippingCents(weightGrams: number, bands: ShippingBand[]): number | null {
  if (!Number.isFinite(weightGrams) || weightGrams < 0) throw new RangeError('Parcel weight must be a number ≥ 0');
  let best: ShippingBand | null = null;
  for (const band of bands) {
    if (!Number.isFinite(band.upToGrams) || !Number.isInteger(band.cents) || band.cents < 0) {
      throw new RangeError('A shipping band needs a weight limit and a whole price in cents ≥ 0');
    }
    if (weightGrams <= band.upToGrams && (best === null || band.upToGrams < best.upToGrams)) best = band;
  }
  return best === null ? null : best.cents;
}

/** Gross weight of a parcel's jars: Σ quantity × (net honey + empty container). */
export function parcelWeightGrams(lines: ParcelLine[]): number {
  let total = 0;
  for (const line of lines) {
    if (!Number.isInteger(line.quantity) || line.quantity < 0)
      throw new RangeError('Quantity must be a whole number ≥ 0');
    if (
      !Number.isFinite(line.netGrams) ||
      line.netGrams < 0 ||
      !Number.isFinite(line.containerGrams) ||
      line.containerGrams < 0
    ) {
      throw new RangeError('Net and container weights must be numbers ≥ 0');
    }
    total += line.quantity * (line.netGrams + line.containerGrams);
  }
  return Math.round(total);
}
