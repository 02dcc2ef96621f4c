import { describe, expect, it } from 'vitest';
import { DEFAULT_LAB_LIMITS, checkLabResults } from '@/lib/domain/lab-results';

describe('DEFAULT_LAB_LIMITS', () => {
  it('carries the EU Annex II limits', () => {
    // EU Council Directive 2001/110/EC Annex II: HMF ≤ 40 mg/kg, diastase ≥ 8 Schade, insoluble ≤ 0.1 g/100 g
    expect(DEFAULT_LAB_LIMITS).toEqual({ hmfMaxMgKg: 40, diastaseMinSchade: 8, insolubleMaxG100g: 0.1 });
  });
});

describe('checkLabResults', () => {
  it('passes values on the limits', () => {
    // EU Council Directive 2001/110/EC Annex II: HMF ≤ 40, diastase ≥ 8, insoluble ≤ 0.1 — the limit itself passes
    expect(checkLabResults({ hmfMgKg: 40, diastaseSchade: 8, insolubleG100g: 0.1 }, DEFAULT_LAB_LIMITS)).toEqual({
      pass: true,
      failures: [],
    });
  });

  it('fails each value just past its limit, in words', () => {
    const result = checkLabResults({ hmfMgKg: 40.1, diastaseSchade: 7.9, insolubleG100g: 0.11 }, DEFAULT_LAB_LIMITS);
    expect(result.pass).toBe(false);
    expect(result.failures).toEqual([
      'HMF 40.1 mg/kg is above the 40 mg/kg limit',
      'Diastase activity 7.9 Schade is below the 8 Schade minimum',
      'Water-insoluble content 0.11 g/100 g is above the 0.1 g/100 g limit',
    ]);
  });

  it('skips results the lab did not report', () => {
    expect(checkLabResults({ hmfMgKg: null, diastaseSchade: undefined }, DEFAULT_LAB_LIMITS).pass).toBe(true);
    expect(checkLabResults({}).pass).toBe(true);
    expect(checkLabResults({ hmfMgKg: 55 }).failures).toHaveLength(1);
  });

  it('uses owner limits, e.g. declared tropical origin', () => {
    // EU Council Directive 2001/110/EC Annex II, HMF ≤ 80 mg/kg for declared tropical origin
    const tropical = { ...DEFAULT_LAB_LIMITS, hmfMaxMgKg: 80 };
    expect(checkLabResults({ hmfMgKg: 60 }, tropical).pass).toBe(true);
    expect(checkLabResults({ hmfMgKg: 60 }, DEFAULT_LAB_LIMITS).pass).toBe(false);
  });

  it('rejects impossible numbers', () => {
    expect(() => checkLabResults({ hmfMgKg: -1 })).toThrow(RangeError);
    expect(() => checkLabResults({ diastaseSchade: Number.NaN })).toThrow(RangeError);
  });
});
