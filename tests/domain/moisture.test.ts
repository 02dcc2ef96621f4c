import { describe, expect, it } from 'vitest';
import {
  DEFAULT_MOISTURE_LIMITS,
  fermentationRisk,
  gradeMoisture,
  moistureSummary,
  refractiveIndexFromWater,
  waterFromRefractiveIndex,
  waterFromScaleReading,
} from '@/lib/domain/moisture';

// The Wedmore formula reproduces the Chataway/Wedmore table to within about 0.02 % water;
// the table's 4-decimal refractive index adds up to ±0.00005 (≈ 0.02 %), hence 0.03.
const TABLE_TOLERANCE = 0.03;
const near = (actual: number, expected: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(TABLE_TOLERANCE);

describe('waterFromRefractiveIndex at 20 °C against the Chataway/Wedmore table', () => {
  const published: [number, number, string][] = [
    [1.5044, 13.0, 'Chataway/Wedmore table, AOAC 969.38 B'],
    [1.4992, 15.0, 'Chataway/Wedmore table, AOAC 969.38 B'],
    [1.4966, 16.0, 'Chataway/Wedmore table, AOAC 969.38 B'],
    [1.489, 19.0, 'Chataway/Wedmore table, AOAC 969.38 B'],
    [1.4865, 20.0, 'Chataway/Wedmore table, AOAC 969.38 B'],
    [1.4815, 22.0, 'Chataway/Wedmore table, AOAC 969.38 B'],
  ];
  it.each(published)('%f → %f %% (%s)', (ri, water) => near(waterFromRefractiveIndex(ri), water));

  // from memory: further rows of the same Chataway/Wedmore table (AOAC 969.38 B), whole
  // per cents 14–25 and the 18.6 % US grade edge; each agrees with the formula within 0.03.
  const fromMemory: [number, number][] = [
    [1.5018, 14.0],
    [1.494, 17.0],
    [1.4915, 18.0],
    [1.49, 18.6],
    [1.484, 21.0],
    [1.479, 23.0],
    [1.4765, 24.0],
    [1.474, 25.0],
  ];
  it.each(fromMemory)('%f → %f %% (from memory, Chataway/Wedmore table)', (ri, water) =>
    near(waterFromRefractiveIndex(ri), water),
  );

  it('falls as the refractive index rises (13–25 % water)', () => {
    let previous = Number.POSITIVE_INFINITY;
    for (let ri = 1.474; ri <= 1.5045; ri += 0.0005) {
      const water = waterFromRefractiveIndex(ri);
      expect(water).toBeLessThan(previous);
      previous = water;
    }
  });

  it('is not the misprinted formula with +0.2681 (hundreds of per cent)', () => {
    // a misprint of the formula in circulation flips the sign of 0.2681
    expect(waterFromRefractiveIndex(1.4865)).toBeLessThan(30);
  });
});

describe('temperature correction', () => {
  it('adds 0.00023 per °C above 20 °C', () => {
    // Refractometer temperature correction (AOAC 969.38 B; IHC Harmonised methods): +0.00023 per °C above 20 → 1.4842 at 30 °C reads as 1.4865 (20.0 %)
    near(waterFromRefractiveIndex(1.4842, 30), 20.0);
    expect(waterFromRefractiveIndex(1.4842, 30)).toBeCloseTo(waterFromRefractiveIndex(1.4865, 20), 10);
  });

  it('subtracts 0.00023 per °C below 20 °C', () => {
    // Refractometer temperature correction (AOAC 969.38 B; IHC Harmonised methods): −0.00023 per °C below 20 → 1.4913 at 10 °C reads as 1.4890 (19.0 %)
    near(waterFromRefractiveIndex(1.4913, 10), 19.0);
    expect(waterFromRefractiveIndex(1.4913, 10)).toBeCloseTo(waterFromRefractiveIndex(1.489), 10);
  });
});

describe('bad readings throw RangeError', () => {
  it.each([Number.NaN, Number.POSITIVE_INFINITY, 1.333, 1.4699, 1.5101, 15])('refractive index %f', (ri) => {
    expect(() => waterFromRefractiveIndex(ri)).toThrow(RangeError);
  });
  it('checks the range after temperature correction', () => {
    expect(() => waterFromRefractiveIndex(1.471, 5)).toThrow(RangeError); // 1.4710 − 15·0.00023 = 1.46755
    expect(() => waterFromRefractiveIndex(1.505, 45)).toThrow(RangeError); // 1.5050 + 25·0.00023 = 1.51075
  });
  it.each([4.9, 45.1, -20, Number.NaN])('temperature %f °C', (t) => {
    expect(() => waterFromRefractiveIndex(1.49, t)).toThrow(RangeError);
  });
});

describe('inverse and scale readings', () => {
  it('round-trips water → refractive index → water across 13–25 %', () => {
    for (let w = 13; w <= 25; w += 0.2) expect(waterFromRefractiveIndex(refractiveIndexFromWater(w))).toBeCloseTo(w, 9);
  });

  it('gives table refractive indices back', () => {
    // Chataway/Wedmore table, AOAC 969.38 B: 20.0 % → 1.4865, 13.0 % → 1.5044
    expect(Math.abs(refractiveIndexFromWater(20) - 1.4865)).toBeLessThan(0.0001);
    expect(Math.abs(refractiveIndexFromWater(13) - 1.5044)).toBeLessThan(0.0001);
  });

  it('takes a compensated scale reading as is', () => {
    expect(waterFromScaleReading(18.2)).toBe(18.2);
    expect(() => waterFromScaleReading(40)).toThrow(RangeError);
  });

  it('corrects an uncompensated scale reading through the refractive index', () => {
    // Refractometer temperature correction (AOAC 969.38 B; IHC Harmonised methods): 10 °C above 20 adds 0.0023 to the index, i.e. the honey is drier
    const expected = waterFromRefractiveIndex(refractiveIndexFromWater(20) + 0.0023);
    expect(waterFromScaleReading(20, 30)).toBeCloseTo(expected, 10);
    expect(waterFromScaleReading(20, 30)).toBeLessThan(20);
    expect(waterFromScaleReading(20, 10)).toBeGreaterThan(20);
    expect(waterFromScaleReading(20, 20)).toBeCloseTo(20, 9);
  });
});

describe('moistureSummary', () => {
  it('summarises several readings', () => {
    expect(moistureSummary([17.2, 18.4, 17.8])).toEqual({ highest: 18.4, mean: expect.closeTo(17.8, 10), count: 3 });
    expect(moistureSummary([])).toBeNull();
    expect(() => moistureSummary([17, Number.NaN])).toThrow(RangeError);
  });
});

describe('gradeMoisture', () => {
  it('uses the EU and USDA defaults', () => {
    // EU Council Directive 2001/110/EC Annex II ≤ 20 % (heather ≤ 23 %); USDA grades (1985) A/B ≤ 18.6 %
    expect(DEFAULT_MOISTURE_LIMITS).toEqual({ generalPct: 20, heatherPct: 23, gradeAPct: 18.6 });
  });

  it('grades against the general limit at its edges', () => {
    const edge = gradeMoisture(20.0, DEFAULT_MOISTURE_LIMITS); // EU 2001/110/EC Annex II: ≤ 20 % passes
    expect(edge).toMatchObject({ withinLimit: true, limitPct: 20, usGradeAB: false });
    expect(edge.label).toBe('20 % water: within the limit of 20 %');
    expect(gradeMoisture(20.1, DEFAULT_MOISTURE_LIMITS).withinLimit).toBe(false);
    expect(gradeMoisture(20.1, DEFAULT_MOISTURE_LIMITS).label).toBe('20.1 % water: over the limit of 20 %');
  });

  it('uses the heather limit when asked', () => {
    // EU Council Directive 2001/110/EC Annex II, heather (Calluna) ≤ 23 %
    expect(gradeMoisture(22.5, DEFAULT_MOISTURE_LIMITS, { heather: true })).toMatchObject({
      withinLimit: true,
      limitPct: 23,
    });
    expect(gradeMoisture(23.2, DEFAULT_MOISTURE_LIMITS, { heather: true }).withinLimit).toBe(false);
  });

  it('marks US Grade A/B at 18.6 % and below', () => {
    // USDA U.S. Standards for Grades of Extracted Honey (1985), Grade A and B ≤ 18.6 %
    expect(gradeMoisture(18.6, DEFAULT_MOISTURE_LIMITS).usGradeAB).toBe(true);
    expect(gradeMoisture(18.6, DEFAULT_MOISTURE_LIMITS).label).toContain(
      'water within the US Grade A limit (≤ 18.6 %)',
    );
    expect(gradeMoisture(18.6, DEFAULT_MOISTURE_LIMITS).label).not.toMatch(/meets|Grade A\/B/);
    expect(gradeMoisture(18.7, DEFAULT_MOISTURE_LIMITS).usGradeAB).toBe(false);
  });

  // Decided on the value rounded to the refractometer's 0.1 % (Chataway/Wedmore table, AOAC 969.38 B is in 0.1 % steps).
  it('moisture at the limit: decides on the value shown, rounded to 0.1 %', () => {
    const w = waterFromRefractiveIndex(1.4864); // 20.02 % by the Wedmore formula
    expect(w).toBeGreaterThan(20);
    const g = gradeMoisture(w, DEFAULT_MOISTURE_LIMITS);
    expect(g.withinLimit).toBe(true);
    expect(g.label).toBe('20 % water: within the limit of 20 %');
    expect(gradeMoisture(20.049, DEFAULT_MOISTURE_LIMITS).withinLimit).toBe(true);
    expect(gradeMoisture(20.05, DEFAULT_MOISTURE_LIMITS).label).toBe('20.1 % water: over the limit of 20 %');
    expect(gradeMoisture(18.64, DEFAULT_MOISTURE_LIMITS).usGradeAB).toBe(true);
    expect(gradeMoisture(18.65, DEFAULT_MOISTURE_LIMITS).usGradeAB).toBe(false);
  });

  it('follows owner-set limits', () => {
    expect(gradeMoisture(18.5, { generalPct: 18, heatherPct: 21, gradeAPct: 17 }).withinLimit).toBe(false);
  });
});

describe('fermentationRisk', () => {
  // USDA Agriculture Handbook 335 after Lochhead (common practice):
  // < 17.1 low; 17.1–18.0 yeast ≤ 1000/g; 18.1–19.0 yeast ≤ 10/g; > 19 likely
  const cases: [number, string][] = [
    [13, 'low'],
    [17.0, 'low'],
    [17.1, 'yeast-dependent'],
    [18.0, 'yeast-dependent'],
    [17.04, 'low'], // reads 17.0 %
    [17.05, 'yeast-dependent'], // reads 17.1 %
    [18.04, 'yeast-dependent'], // reads 18.0 %
    [18.05, 'high-yeast-dependent'], // reads 18.1 %
    [19.04, 'high-yeast-dependent'], // reads 19.0 %
    [19.05, 'likely'], // reads 19.1 %
    [18.1, 'high-yeast-dependent'],
    [19.0, 'high-yeast-dependent'],
    [19.1, 'likely'],
    [25, 'likely'],
  ];
  it.each(cases)('%f %% → %s', (water, band) => expect(fermentationRisk(water).band).toBe(band));

  it('says it in words', () => {
    expect(fermentationRisk(17.5).label).toBe('Safe only if yeast count ≤ 1000/g');
    expect(fermentationRisk(18.5).label).toBe('Safe only if yeast count ≤ 10/g');
  });
});
