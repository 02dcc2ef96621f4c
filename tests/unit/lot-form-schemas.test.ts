import { describe, expect, it } from 'vitest';
import { emptyWeightInput, readingFormInput, readingInput, waxInput } from '@/lib/schemas/lots';

describe('the reading form sends a reading of the chosen kind', () => {
  it('a honey-scale reading without temperature is temperature-compensated', () => {
    const sent = readingFormInput.parse({
      lotId: 3,
      method: 'scale',
      refractiveIndex: '',
      scaleWaterPct: '17.8',
      temperatureC: '',
      takenOn: '2026-08-02',
    });
    expect(sent).toEqual({
      lotId: 3,
      method: 'scale',
      scaleWaterPct: 17.8,
      temperatureC: undefined,
      takenOn: '2026-08-02',
    });
    expect(readingInput.safeParse(sent).success).toBe(true);
  });
  it('a refractive index needs its sample temperature', () => {
    const r = readingFormInput.safeParse({
      lotId: 3,
      method: 'ri',
      refractiveIndex: '1.4900',
      scaleWaterPct: '',
      temperatureC: '',
      takenOn: '2026-08-02',
    });
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.path.join('.'))).toEqual(['temperatureC']);
  });
});

describe('a weight typed in a small form', () => {
  it('reads a decimal comma as a point', () => {
    expect(waxInput.parse({ lotId: 1, wax: '1,5', unit: 'kg' }).wax).toBe(1.5);
  });
  it('refuses a blank instead of reading it as 0', () => {
    expect(waxInput.safeParse({ lotId: 1, wax: '', unit: 'kg' }).success).toBe(false);
    expect(emptyWeightInput.safeParse({ lotId: 1, superPullId: 2, empty: ' ', unit: 'kg' }).success).toBe(false);
  });
});
