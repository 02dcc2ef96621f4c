/**
 * Field-sheet CSV import of super pulls: checks each data row (numbered from 1, the
 * header not counted) and returns the good rows and the errors, all at once.
 * Dates: ISO 8601 calendar dates (YYYY-MM-DD) only — 02/05/2026 reads as 2 May or
 * 5 February depending on the country, so it is refused rather than guessed.
 * Full weight: a full super weighs 2–45 kg; the unit is the row's unit column (kg or
 * lb) or the default (kg), stored as whole grams. Frame count defaults to 10 when
 * blank. Wholly blank lines are skipped (they keep their row number).
 */
import { z } from 'zod';
import { toGrams } from './units';

export type PullMapping = {
  colonyCode: string;
  pulledOn: string;
  depth: string;
  frameCount?: string;
  fullWeight?: string;
  weightUnit?: string;
  cappedFrames?: string;
  tagCode?: string;
};
export type ValidPullRow = {
  row: number;
  colonyCode: string;
  pulledOn: string;
  depth: 'deep' | 'medium' | 'shallow';
  frameCount: number;
  fullGrams: number | null;
  cappedFrames: number | null;
  tagCode: string | null;
};
export type PullRowError = { row: number; messages: string[]; raw: Record<string, string> };
export type PullImportOptions = { today?: string; defaultWeightUnit?: 'kg' | 'lb'; defaultFrameCount?: number };

const isoDate = z.iso.date();
const depthSchema = z.enum(['deep', 'medium', 'shallow']);
const unitSchema = z.enum(['kg', 'kgs', 'lb', 'lbs']);
const frameCountSchema = z.number().int().min(1).max(12);
const MIN_FULL_GRAMS = 2_000;
const MAX_FULL_GRAMS = 45_000;

/** A plain decimal ("12.5" or "12,5"), or null. */
function decimal(text: string): number | null {
  return /^\d+(?:[.,]\d+)?$/.test(text) ? Number(text.replace(',', '.')) : null;
}

function cell(raw: Record<string, string>, column: string | undefined): string {
  return column === undefined ? '' : (raw[column] ?? '').trim();
}

/** Valid rows and per-row errors. Pass `today` as the business's local date (default: today in UTC). */
export function validatePullRows(
  rows: Record<string, string>[],
  mapping: PullMapping,
  known: { colonyCodes: Set<string>; existingTagCodes: Set<string> },
  opts: PullImportOptions = {},
): { valid: ValidPullRow[]; errors: PullRowError[] } {
  const today = opts.today ?? new Date().toISOString().slice(0, 10);
  const colonies = new Map([...known.colonyCodes].map((code) => [code.toUpperCase(), code]));
  const seenKeys = new Map<string, number>();
  const seenTags = new Map<string, number>();
  const valid: ValidPullRow[] = [];
  const errors: PullRowError[] = [];

  rows.forEach((raw, index) => {
    const row = index + 1;
    if (Object.values(raw).every((value) => (value ?? '').trim() === '')) return; // blank line on the sheet
    const messages: string[] = [];
    const get = (column: string | undefined) => cell(raw, column);

    const colonyText = get(mapping.colonyCode);
    const colonyCode = colonies.get(colonyText.toUpperCase());
    if (!colonyText) messages.push('Colony code is missing');
    else if (!colonyCode) messages.push(`Unknown colony "${colonyText}"`);

    const pulledOn = get(mapping.pulledOn);
    if (!pulledOn) messages.push('Pull date is missing');
    else if (!isoDate.safeParse(pulledOn).success)
      messages.push(`Date "${pulledOn}" is not a YYYY-MM-DD date (only ISO dates are accepted)`);
    else if (pulledOn > today) messages.push(`Date ${pulledOn} is in the future`);

    const depth = depthSchema.safeParse(get(mapping.depth).toLowerCase());
    if (!depth.success) messages.push(`Box depth "${get(mapping.depth)}" is not deep, medium or shallow`);

    const frameText = get(mapping.frameCount);
    const frameCount = frameText
      ? frameCountSchema.safeParse(decimal(frameText))
      : frameCountSchema.safeParse(opts.defaultFrameCount ?? 10);
    if (!frameCount.success) messages.push(`Frame count "${frameText}" must be a whole number from 1 to 12`);

    let cappedFrames: number | null = null;
    const cappedText = get(mapping.cappedFrames);
    if (cappedText) {
      const capped = decimal(cappedText);
      const max = frameCount.success ? frameCount.data : 12;
      if (capped === null || !Number.isInteger(capped) || capped > max)
        messages.push(`Capped frames "${cappedText}" must be a whole number from 0 to ${max}`);
      else cappedFrames = capped;
    }

    let fullGrams: number | null = null;
    const weightText = get(mapping.fullWeight);
    const unitText = get(mapping.weightUnit).toLowerCase();
    const unit = unitText ? unitSchema.safeParse(unitText) : unitSchema.safeParse(opts.defaultWeightUnit ?? 'kg');
    if (!unit.success) messages.push(`Weight unit "${get(mapping.weightUnit)}" is not kg or lb`);
    if (weightText) {
      const value = decimal(weightText);
      if (value === null) messages.push(`Full weight "${weightText}" is not a number`);
      else if (unit.success) {
        const grams = toGrams(value, unit.data.startsWith('kg') ? 'kg' : 'lb');
        if (grams < MIN_FULL_GRAMS || grams > MAX_FULL_GRAMS)
          messages.push(`Full weight ${weightText} ${unit.data} is outside 2–45 kg for a full super`);
        else fullGrams = grams;
      }
    }

    // Tags are printed in capitals; a sheet's "wt-0001" is the same box as "WT-0001".
    const tagCode = get(mapping.tagCode).toUpperCase() || null;
    const key = colonyText && pulledOn ? `${colonyCode ?? colonyText}|${pulledOn}|${tagCode ?? ''}` : null;
    const firstRow = key === null ? undefined : seenKeys.get(key);
    if (firstRow !== undefined) messages.push(`Same colony, date and tag as row ${firstRow}`);
    else if (tagCode && seenTags.has(tagCode))
      messages.push(`Tag code ${tagCode} is also on row ${seenTags.get(tagCode)}`);
    if (tagCode && known.existingTagCodes.has(tagCode)) messages.push(`Tag code ${tagCode} is already used`);
    if (key !== null && firstRow === undefined) seenKeys.set(key, row);
    if (tagCode && !seenTags.has(tagCode)) seenTags.set(tagCode, row);

    if (messages.length > 0 || !colonyCode || !depth.success || !frameCount.success) {
      errors.push({ row, messages, raw });
      return;
    }
    valid.push({
      row,
      colonyCode,
      pulledOn,
      depth: depth.data,
      frameCount: frameCount.data,
      fullGrams,
      cappedFrames,
      tagCode,
    });
  });

  return { valid, errors };
}
