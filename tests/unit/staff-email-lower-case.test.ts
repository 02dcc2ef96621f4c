import { describe, expect, it } from 'vitest';
import { staffInput } from '@/lib/schemas/staff';

// The staff form parses with this same schema in the browser, so what it sends (and shows) is
// the address the account gets.
describe('a staff e-mail address is lower-cased', () => {
  it('the shared staff schema lower-cases and trims the e-mail', () => {
    const parsed = staffInput.parse({ name: 'Wren Tallis', email: '  Wren.Tallis@Example.TEST ', role: 'keeper' });
    expect(parsed.email).toBe('wren.tallis@example.test');
  });
});
