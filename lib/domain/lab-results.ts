/**
 * Laboratory results against honey composition limits. Defaults: EU Council
 * Directive 2001/110/EC, Annex II — HMF ≤ 40 mg/kg, diastase activity ≥ 8 Schade
 * units, water-insoluble content ≤ 0.1 g/100 g. The Directive's special cases
 * (HMF ≤ 80 mg/kg for declared tropical origin; diastase ≥ 3 for low-enzyme honey
 * with HMF ≤ 15 mg/kg; pressed honey ≤ 0.5 g/100 g insoluble) are set by the owner
 * through `limits`. A missing result is not checked.
 */

export type LabLimits = { hmfMaxMgKg: number; diastaseMinSchade: number; insolubleMaxG100g: number };
export type LabResults = { hmfMgKg?: number | null; diastaseSchade?: number | null; insolubleG100g?: number | null };

export const DEFAULT_LAB_LIMITS: LabLimits = { hmfMaxMgKg: 40, diastaseMinSchade: 8, insolubleMaxG100g: 0.1 };

function present(value: number | null | undefined, what: string): value is number {
  if (value === null || value === undefined) return false;
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`${what} must be a number ≥ 0`);
  return true;
}

/** Whether the lab results meet the limits, with one plain sentence per failure. */
export function checkLabResults(
  results: LabResults,
  limits: LabLimits = DEFAULT_LAB_LIMITS,
): { pass: boolean; failures: string[] } {
  const failures: string[] = [];
  if (present(results.hmfMgKg, 'HMF') && results.hmfMgKg > limits.hmfMaxMgKg) {
    failures.push(`HMF ${results.hmfMgKg} mg/kg is above the ${limits.hmfMaxMgKg} mg/kg limit`);
  }
  if (present(results.diastaseSchade, 'Diastase activity') && results.diastaseSchade < limits.diastaseMinSchade) {
    failures.push(
      `Diastase activity ${results.diastaseSchade} Schade is below the ${limits.diastaseMinSchade} Schade minimum`,
    );
  }
  if (present(results.insolubleG100g, 'Water-insoluble content') && results.insolubleG100g > limits.insolubleMaxG100g) {
    failures.push(
      `Water-insoluble content ${results.insolubleG100g} g/100 g is above the ${limits.insolubleMaxG100g} g/100 g limit`,
    );
  }
  return { pass: failures.length === 0, failures };
}

/**
 * The full composition check of EU Council Directive 2001/110/EC, Annex II (points 1–6), each
 * row with its conditions. Checked against the Annex text (consolidated English text); the
 * tropical HMF row's wording after "regions with tropical climate" is from memory.
 */
export type HoneyCategory = {
  origin: 'blossom' | 'honeydew' | 'honeydew-blossom-blend';
  bakers?: boolean;
  pressed?: boolean;
  tropical?: boolean;
  lowEnzyme?: boolean;
  /** Floral source key, e.g. 'calluna', 'chestnut', 'citrus', 'lavender' (see HONEY_SOURCES). */
  source?: string;
};

export type CompositionResults = {
  waterPct?: number;
  fructoseGlucoseG100g?: number;
  sucroseG100g?: number;
  insolubleG100g?: number;
  conductivityMsCm?: number;
  freeAcidMeqKg?: number;
  diastaseSchade?: number;
  hmfMgKg?: number;
};

export type CompositionCriterion =
  'water' | 'sugars' | 'sucrose' | 'insoluble' | 'conductivity' | 'free-acid' | 'diastase' | 'hmf';

export type CompositionFailure = { criterion: CompositionCriterion; value: number; limit: number };

/** The floral sources the Annex names, with the words the screens use. */
export const HONEY_SOURCES = {
  calluna: 'Ling heather (Calluna vulgaris)',
  chestnut: 'Chestnut',
  citrus: 'Citrus',
  lavender: 'Lavender (Lavandula)',
  borage: 'Borage (Borago officinalis)',
  'false-acacia': 'False acacia (Robinia pseudoacacia)',
  alfalfa: 'Alfalfa (Medicago sativa)',
  'banksia-menziesii': 'Menzies banksia (Banksia menziesii)',
  hedysarum: 'French honeysuckle (Hedysarum)',
  'eucalyptus-camaldulensis': 'Red gum (Eucalyptus camaldulensis)',
  leatherwood: 'Leatherwood (Eucryphia)',
  'strawberry-tree': 'Strawberry tree (Arbutus unedo)',
  erica: 'Bell heather (Erica)',
  eucalyptus: 'Eucalyptus',
  lime: 'Lime (Tilia)',
  manuka: 'Manuka or jelly bush (Leptospermum)',
  'tea-tree': 'Tea tree (Melaleuca)',
} as const;
export type HoneySource = keyof typeof HONEY_SOURCES;

// Annex II 1.2: sucrose ≤ 10 g/100 g for these sources, ≤ 15 for lavender and borage.
const SUCROSE_10 = new Set([
  'false-acacia',
  'alfalfa',
  'banksia-menziesii',
  'hedysarum',
  'eucalyptus-camaldulensis',
  'leatherwood',
  'citrus',
]);
const SUCROSE_15 = new Set(['lavender', 'borage']);
// Annex II 4: the exceptions, with no conductivity limit. Red gum is a eucalyptus.
const CONDUCTIVITY_EXCEPTIONS = new Set([
  'strawberry-tree',
  'erica',
  'eucalyptus',
  'eucalyptus-camaldulensis',
  'lime',
  'calluna',
  'manuka',
  'tea-tree',
]);

export type CompositionLimits = { [K in CompositionCriterion]: { min?: number; max?: number } | null };

/**
 * The Annex II limit of each criterion for one honey category; null where the Annex sets none
 * (baker's honey has no diastase or HMF limit; the conductivity exceptions have no limit).
 * `hmfMgKg` decides the low-enzyme diastase row: the ≥ 3 limit needs an HMF result ≤ 15 mg/kg;
 * without one the general ≥ 8 applies.
 */
export function compositionLimits(category: HoneyCategory, hmfMgKg?: number): CompositionLimits {
  const calluna = category.source === 'calluna';
  const bakers = category.bakers === true;
  const honeydew = category.origin !== 'blossom';
  const source = category.source ?? '';
  // e.g. citrus honeys: Annex II 6(a) names them as honeys with low natural enzyme content.
  const lowEnzyme = category.lowEnzyme === true || source === 'citrus';
  let conductivity: { min?: number; max?: number } | null;
  if (CONDUCTIVITY_EXCEPTIONS.has(source)) conductivity = null;
  else if (honeydew || source === 'chestnut') conductivity = { min: 0.8 };
  else conductivity = { max: 0.8 };
  return {
    // Annex II 2: 20 % in general; 23 % heather (Calluna) and baker's honey; 25 % baker's from Calluna.
    water: { max: bakers && calluna ? 25 : bakers || calluna ? 23 : 20 },
    // Annex II 1.1: blossom ≥ 60; honeydew and blends of honeydew with blossom ≥ 45.
    sugars: { min: honeydew ? 45 : 60 },
    // Annex II 1.2
    sucrose: { max: SUCROSE_15.has(source) ? 15 : SUCROSE_10.has(source) ? 10 : 5 },
    // Annex II 3
    insoluble: { max: category.pressed ? 0.5 : 0.1 },
    // Annex II 4
    conductivity,
    // Annex II 5
    'free-acid': { max: bakers ? 80 : 50 },
    // Annex II 6(a): ≥ 8 except baker's; ≥ 3 for low natural enzyme content and HMF ≤ 15 mg/kg.
    diastase: bakers ? null : { min: lowEnzyme && hmfMgKg !== undefined && hmfMgKg <= 15 ? 3 : 8 },
    // Annex II 6(b): ≤ 40 except baker's; ≤ 80 for declared origin from tropical climates and their blends.
    hmf: bakers ? null : { max: category.tropical ? 80 : 40 },
  };
}

export const COMPOSITION_RESULT_KEY: Record<CompositionCriterion, keyof CompositionResults> = {
  water: 'waterPct',
  sugars: 'fructoseGlucoseG100g',
  sucrose: 'sucroseG100g',
  insoluble: 'insolubleG100g',
  conductivity: 'conductivityMsCm',
  'free-acid': 'freeAcidMeqKg',
  diastase: 'diastaseSchade',
  hmf: 'hmfMgKg',
};
export const COMPOSITION_CRITERIA = Object.keys(COMPOSITION_RESULT_KEY) as CompositionCriterion[];

/**
 * Results against EU Council Directive 2001/110/EC, Annex II for the honey's category. A result
 * not measured is not checked; a value on the limit meets it. Impossible numbers throw.
 */
export function assessComposition(
  results: CompositionResults,
  category: HoneyCategory,
): { pass: boolean; failures: CompositionFailure[] } {
  for (const key of Object.values(COMPOSITION_RESULT_KEY)) {
    const v = results[key];
    if (v !== undefined && v !== null && (!Number.isFinite(v) || v < 0)) {
      throw new RangeError(`${key} must be a number ≥ 0`);
    }
  }
  const hmf = results.hmfMgKg ?? undefined;
  const limits = compositionLimits(category, hmf);
  const failures: CompositionFailure[] = [];
  for (const criterion of COMPOSITION_CRITERIA) {
    const value = results[COMPOSITION_RESULT_KEY[criterion]];
    const limit = limits[criterion];
    if (value === undefined || value === null || limit === null) continue;
    if (limit.max !== undefined && value > limit.max) failures.push({ criterion, value, limit: limit.max });
    if (limit.min !== undefined && value < limit.min) failures.push({ criterion, value, limit: limit.min });
  }
  return { pass: failures.length === 0, failures };
}
