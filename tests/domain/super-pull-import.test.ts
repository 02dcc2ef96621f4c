import { describe, expect, it } from 'vitest';
import { validatePullRows, type PullMapping } from '@/lib/domain/super-pull-import';
import { kgToGrams, lbToGrams } from '@/lib/domain/units';

const mapping: PullMapping = {
  colonyCode: 'Colony',
  pulledOn: 'Date',
  depth: 'Box',
  frameCount: 'Frames',
  fullWeight: 'Weight',
  weightUnit: 'Unit',
  cappedFrames: 'Capped',
  tagCode: 'Tag',
};
const known = { colonyCodes: new Set(['OT-01', 'OT-02', 'LR-07']), existingTagCodes: new Set(['T-0099']) };
const opts = { today: '2026-07-20' };

function row(over: Record<string, string> = {}): Record<string, string> {
  return {
    Colony: 'OT-01',
    Date: '2026-07-18',
    Box: 'medium',
    Frames: '10',
    Weight: '24.5',
    Unit: 'kg',
    Capped: '8',
    Tag: 'T-0100',
    ...over,
  };
}
function errorsOf(rows: Record<string, string>[]) {
  return validatePullRows(rows, mapping, known, opts).errors;
}

describe('validatePullRows: good rows', () => {
  it('returns typed rows with whole grams', () => {
    const { valid, errors } = validatePullRows(
      [row(), row({ Colony: 'lr-07', Box: 'Deep', Weight: '61,5', Unit: 'lb', Tag: '', Capped: '' })],
      mapping,
      known,
      opts,
    );
    expect(errors).toEqual([]);
    expect(valid).toEqual([
      {
        row: 1,
        colonyCode: 'OT-01',
        pulledOn: '2026-07-18',
        depth: 'medium',
        frameCount: 10,
        fullGrams: kgToGrams(24.5),
        cappedFrames: 8,
        tagCode: 'T-0100',
      },
      {
        row: 2,
        colonyCode: 'LR-07',
        pulledOn: '2026-07-18',
        depth: 'deep',
        frameCount: 10,
        fullGrams: lbToGrams(61.5),
        cappedFrames: null,
        tagCode: null,
      },
    ]);
  });

  it('uses the defaults when optional columns are not mapped', () => {
    const minimal: PullMapping = { colonyCode: 'Colony', pulledOn: 'Date', depth: 'Box', fullWeight: 'Weight' };
    const { valid } = validatePullRows(
      [{ Colony: 'OT-02', Date: '2026-07-20', Box: 'shallow', Weight: '40' }],
      minimal,
      known,
      { ...opts, defaultWeightUnit: 'lb' },
    );
    expect(valid[0]).toMatchObject({ frameCount: 10, fullGrams: lbToGrams(40), tagCode: null, cappedFrames: null });
  });

  it('skips wholly blank lines but keeps row numbers', () => {
    const blank = Object.fromEntries(Object.keys(row()).map((k) => [k, ' ']));
    const { valid, errors } = validatePullRows([row(), blank, row({ Tag: 'T-0101' })], mapping, known, opts);
    expect(errors).toEqual([]);
    expect(valid.map((v) => v.row)).toEqual([1, 3]);
  });
});

describe('validatePullRows: errors', () => {
  it('reports an unknown colony and keeps the raw row', () => {
    const raw = row({ Colony: 'XX-9' });
    expect(errorsOf([raw])).toEqual([{ row: 1, messages: ['Unknown colony "XX-9"'], raw }]);
  });

  it('accepts ISO dates only, real ones, not in the future', () => {
    expect(errorsOf([row({ Date: '18/07/2026' })])[0].messages).toEqual([
      'Date "18/07/2026" is not a YYYY-MM-DD date (only ISO dates are accepted)',
    ]);
    expect(errorsOf([row({ Date: '2026-02-29' })])[0].messages[0]).toContain('not a YYYY-MM-DD date');
    expect(errorsOf([row({ Date: '2026-07-21' })])[0].messages).toEqual(['Date 2026-07-21 is in the future']);
    expect(errorsOf([row({ Date: '2026-07-20' })])).toEqual([]);
  });

  it('checks depth and frame count 1–12', () => {
    expect(errorsOf([row({ Box: 'half' })])[0].messages).toEqual(['Box depth "half" is not deep, medium or shallow']);
    expect(errorsOf([row({ Frames: '12', Capped: '' })])).toEqual([]);
    expect(errorsOf([row({ Frames: '13', Capped: '' })])[0].messages).toEqual([
      'Frame count "13" must be a whole number from 1 to 12',
    ]);
    expect(errorsOf([row({ Frames: '0', Capped: '' })])).toHaveLength(1);
    expect(errorsOf([row({ Frames: '9.5', Capped: '' })])).toHaveLength(1);
    expect(errorsOf([row({ Frames: '8', Capped: '9' })])[0].messages).toEqual([
      'Capped frames "9" must be a whole number from 0 to 8',
    ]);
  });

  it('keeps a full super between 2 and 45 kg, in either unit', () => {
    expect(errorsOf([row({ Weight: '2' })])).toEqual([]);
    expect(errorsOf([row({ Weight: '45' })])).toEqual([]);
    expect(errorsOf([row({ Weight: '1.9' })])[0].messages).toEqual([
      'Full weight 1.9 kg is outside 2–45 kg for a full super',
    ]);
    expect(errorsOf([row({ Weight: '45.1' })])).toHaveLength(1);
    expect(errorsOf([row({ Weight: '99', Unit: 'lb' })])).toEqual([]); // 44.9 kg
    expect(errorsOf([row({ Weight: '100', Unit: 'lbs' })])).toHaveLength(1); // 45.4 kg
    expect(errorsOf([row({ Weight: 'heavy' })])[0].messages).toEqual(['Full weight "heavy" is not a number']);
    expect(errorsOf([row({ Unit: 'st' })])[0].messages).toEqual(['Weight unit "st" is not kg or lb']);
  });

  it('finds duplicates within the file and tags already used', () => {
    const errors = errorsOf([row(), row({ Weight: '25' }), row({ Colony: 'OT-02' }), row({ Tag: 'T-0099' })]);
    expect(errors.map((e) => [e.row, e.messages])).toEqual([
      [2, ['Same colony, date and tag as row 1']],
      [3, ['Tag code T-0100 is also on row 1']],
      [4, ['Tag code T-0099 is already used']],
    ]);
  });

  it('collects every message for a row', () => {
    const [error] = errorsOf([row({ Colony: '', Date: '', Box: '', Weight: '0.5' })]);
    expect(error.messages).toEqual([
      'Colony code is missing',
      'Pull date is missing',
      'Box depth "" is not deep, medium or shallow',
      'Full weight 0.5 kg is outside 2–45 kg for a full super',
    ]);
  });
});
