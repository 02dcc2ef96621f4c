import { describe, expect, it } from 'vitest';
import {
  DEFAULT_LAB_LIMITS,
  assessComposition,
  checkLabResults,
  type CompositionResults,
  type HoneyCategory,
} from '@/lib/domain/lab-results';

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

// EU Council Directive 2001/110/EC, Annex II (composition criteria), row by row. Each limit is
// checked on the limit (meets it) and just past it (fails).
describe('assessComposition (2001/110/EC Annex II)', () => {
  const blossom: HoneyCategory = { origin: 'blossom' };
  const fails = (results: CompositionResults, category: HoneyCategory) =>
    assessComposition(results, category).failures.map((f) => [f.criterion, f.limit]);

  it('point 2, water: 20 % in general', () => {
    expect(assessComposition({ waterPct: 20 }, blossom).pass).toBe(true);
    expect(assessComposition({ waterPct: 20.1 }, blossom).failures).toEqual([
      { criterion: 'water', value: 20.1, limit: 20 },
    ]);
  });
  it('point 2, water: 23 % for heather (Calluna) and for baker’s honey', () => {
    for (const c of [
      { ...blossom, source: 'calluna' },
      { ...blossom, bakers: true },
    ]) {
      expect(fails({ waterPct: 23 }, c)).toEqual([]);
      expect(fails({ waterPct: 23.1 }, c)).toEqual([['water', 23]]);
    }
    // bell heather (Erica) is not Calluna: the general 20 %
    expect(fails({ waterPct: 21 }, { ...blossom, source: 'erica' })).toEqual([['water', 20]]);
  });
  it('point 2, water: 25 % for baker’s honey from Calluna', () => {
    const c = { ...blossom, source: 'calluna', bakers: true };
    expect(fails({ waterPct: 25 }, c)).toEqual([]);
    expect(fails({ waterPct: 25.1 }, c)).toEqual([['water', 25]]);
  });

  it('point 1.1, fructose + glucose: ≥ 60 blossom, ≥ 45 honeydew and honeydew–blossom blends', () => {
    expect(fails({ fructoseGlucoseG100g: 60 }, blossom)).toEqual([]);
    expect(fails({ fructoseGlucoseG100g: 59.9 }, blossom)).toEqual([['sugars', 60]]);
    for (const origin of ['honeydew', 'honeydew-blossom-blend'] as const) {
      expect(fails({ fructoseGlucoseG100g: 45 }, { origin })).toEqual([]);
      expect(fails({ fructoseGlucoseG100g: 44.9 }, { origin })).toEqual([['sugars', 45]]);
    }
  });

  it('point 1.2, sucrose: ≤ 5 in general', () => {
    expect(fails({ sucroseG100g: 5 }, blossom)).toEqual([]);
    expect(fails({ sucroseG100g: 5.1 }, blossom)).toEqual([['sucrose', 5]]);
  });
  it.each([
    'false-acacia',
    'alfalfa',
    'banksia-menziesii',
    'hedysarum',
    'eucalyptus-camaldulensis',
    'leatherwood',
    'citrus',
  ])('point 1.2, sucrose: ≤ 10 for %s', (source) => {
    expect(fails({ sucroseG100g: 10 }, { ...blossom, source })).toEqual([]);
    expect(fails({ sucroseG100g: 10.1 }, { ...blossom, source })).toEqual([['sucrose', 10]]);
  });
  it.each(['lavender', 'borage'])('point 1.2, sucrose: ≤ 15 for %s', (source) => {
    expect(fails({ sucroseG100g: 15 }, { ...blossom, source })).toEqual([]);
    expect(fails({ sucroseG100g: 15.1 }, { ...blossom, source })).toEqual([['sucrose', 15]]);
  });

  it('point 3, water-insoluble: ≤ 0.1 in general, ≤ 0.5 pressed', () => {
    expect(fails({ insolubleG100g: 0.1 }, blossom)).toEqual([]);
    expect(fails({ insolubleG100g: 0.11 }, blossom)).toEqual([['insoluble', 0.1]]);
    expect(fails({ insolubleG100g: 0.5 }, { ...blossom, pressed: true })).toEqual([]);
    expect(fails({ insolubleG100g: 0.51 }, { ...blossom, pressed: true })).toEqual([['insoluble', 0.5]]);
  });

  it('point 4, conductivity: ≤ 0.8 mS/cm for blossom honey not listed', () => {
    expect(fails({ conductivityMsCm: 0.8 }, blossom)).toEqual([]);
    expect(fails({ conductivityMsCm: 0.81 }, blossom)).toEqual([['conductivity', 0.8]]);
    expect(fails({ conductivityMsCm: 0.81 }, { ...blossom, source: 'lavender' })).toEqual([['conductivity', 0.8]]);
  });
  it('point 4, conductivity: ≥ 0.8 mS/cm for honeydew, chestnut and their blends', () => {
    for (const c of [
      { origin: 'honeydew' },
      { origin: 'honeydew-blossom-blend' },
      { ...blossom, source: 'chestnut' },
    ] as HoneyCategory[]) {
      expect(fails({ conductivityMsCm: 0.8 }, c)).toEqual([]);
      expect(fails({ conductivityMsCm: 0.79 }, c)).toEqual([['conductivity', 0.8]]);
    }
  });
  it.each(['strawberry-tree', 'erica', 'eucalyptus', 'lime', 'calluna', 'manuka', 'tea-tree'])(
    'point 4, conductivity: no limit for the exception %s',
    (source) => {
      expect(fails({ conductivityMsCm: 2.5 }, { ...blossom, source })).toEqual([]);
      expect(fails({ conductivityMsCm: 0.1 }, { origin: 'honeydew-blossom-blend', source })).toEqual([]);
    },
  );

  it('point 5, free acid: ≤ 50 meq/kg in general, ≤ 80 baker’s', () => {
    expect(fails({ freeAcidMeqKg: 50 }, blossom)).toEqual([]);
    expect(fails({ freeAcidMeqKg: 50.5 }, blossom)).toEqual([['free-acid', 50]]);
    expect(fails({ freeAcidMeqKg: 80 }, { ...blossom, bakers: true })).toEqual([]);
    expect(fails({ freeAcidMeqKg: 81 }, { ...blossom, bakers: true })).toEqual([['free-acid', 80]]);
  });

  it('point 6(a), diastase: ≥ 8 in general, none for baker’s honey', () => {
    expect(fails({ diastaseSchade: 8 }, blossom)).toEqual([]);
    expect(fails({ diastaseSchade: 7.9 }, blossom)).toEqual([['diastase', 8]]);
    expect(fails({ diastaseSchade: 1 }, { ...blossom, bakers: true })).toEqual([]);
  });
  it('point 6(a), diastase: ≥ 3 for low natural enzyme content with HMF ≤ 15 mg/kg', () => {
    const low = { ...blossom, lowEnzyme: true };
    expect(fails({ diastaseSchade: 3, hmfMgKg: 15 }, low)).toEqual([]);
    expect(fails({ diastaseSchade: 2.9, hmfMgKg: 15 }, low)).toEqual([['diastase', 3]]);
    // HMF above 15: the general ≥ 8 applies (HMF itself still meets its 40)
    expect(fails({ diastaseSchade: 5, hmfMgKg: 15.1 }, low)).toEqual([['diastase', 8]]);
    // HMF not measured: the condition is not shown, so the general ≥ 8 applies
    expect(fails({ diastaseSchade: 5 }, low)).toEqual([['diastase', 8]]);
    // without the low-enzyme flag, ≥ 8 even with low HMF
    expect(fails({ diastaseSchade: 5, hmfMgKg: 10 }, blossom)).toEqual([['diastase', 8]]);
    // citrus honeys are the Annex's own example of low natural enzyme content
    expect(fails({ diastaseSchade: 3, hmfMgKg: 10 }, { ...blossom, source: 'citrus' })).toEqual([]);
  });

  it('point 6(b), HMF: ≤ 40 in general, none for baker’s honey', () => {
    expect(fails({ hmfMgKg: 40 }, blossom)).toEqual([]);
    expect(fails({ hmfMgKg: 40.1 }, blossom)).toEqual([['hmf', 40]]);
    expect(fails({ hmfMgKg: 120 }, { ...blossom, bakers: true })).toEqual([]);
  });
  it('point 6(b), HMF: ≤ 80 for declared origin from tropical climates and their blends', () => {
    const tropical = { ...blossom, tropical: true };
    expect(fails({ hmfMgKg: 60 }, tropical)).toEqual([]);
    expect(fails({ hmfMgKg: 80 }, tropical)).toEqual([]);
    expect(fails({ hmfMgKg: 80.1 }, tropical)).toEqual([['hmf', 80]]);
    expect(fails({ hmfMgKg: 60 }, blossom)).toEqual([['hmf', 40]]);
  });

  it('checks only what was measured, and reports every failure', () => {
    expect(assessComposition({}, blossom)).toEqual({ pass: true, failures: [] });
    const all = assessComposition(
      {
        waterPct: 21,
        fructoseGlucoseG100g: 55,
        sucroseG100g: 6,
        insolubleG100g: 0.2,
        conductivityMsCm: 0.9,
        freeAcidMeqKg: 55,
        diastaseSchade: 6,
        hmfMgKg: 45,
      },
      blossom,
    );
    expect(all.pass).toBe(false);
    expect(all.failures.map((f) => f.criterion)).toEqual([
      'water',
      'sugars',
      'sucrose',
      'insoluble',
      'conductivity',
      'free-acid',
      'diastase',
      'hmf',
    ]);
  });

  it('rejects impossible numbers', () => {
    expect(() => assessComposition({ hmfMgKg: -1 }, blossom)).toThrow(RangeError);
    expect(() => assessComposition({ waterPct: Number.NaN }, blossom)).toThrow(RangeError);
  });
});
