import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { settingsInput } from '@/lib/schemas/settings';
import { BusinessSetting } from '@/models/business-setting';

// Release follows the lot's honey category (EU Council Directive 2001/110/EC, Annex II), so the old
// owner limits for HMF, diastase and water-insoluble content must not reach the settings or the code.
describe('owner lab limits are gone (release follows the honey category, 2001/110/EC Annex II)', () => {
  it('the settings schema neither asks for nor keeps HMF, diastase or insoluble limits', () => {
    const keys = Object.keys(settingsInput.shape);
    expect(keys).not.toContain('hmfMaxMgKg');
    expect(keys).not.toContain('diastaseMinSchade');
    expect(keys).not.toContain('insolubleMaxG100g');
  });
  it('the settings model does not map the unused columns, so nothing can read them', () => {
    const src = readFileSync('models/business-setting.ts', 'utf8');
    expect(src).not.toMatch(/hmfMaxMgKg|diastaseMinSchade|insolubleMaxG100g/);
    expect(BusinessSetting).toBeDefined();
  });
});
