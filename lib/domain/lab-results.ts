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
