import { describe, expect, it } from 'vitest';
import { hashPassword, verifyPassword, newToken, sha256 } from '@/lib/auth/password';
import { passwordProblem } from '@/lib/domain/password-rules';

describe('passwords (ASVS 6.2)', () => {
  it('accepts 8+ characters with no composition rules, long ones too', () => {
    expect(passwordProblem('correct horse')).toBeNull();
    expect(passwordProblem('a'.repeat(64) + ' long passphrase')).toBeNull();
  });
  it('refuses short and common passwords', () => {
    expect(passwordProblem('short')).toMatch(/at least 8/);
    expect(passwordProblem('password123')).toMatch(/too common/);
    expect(passwordProblem('PASSWORD1')).toMatch(/too common/);
  });
  it('hashes with salt and verifies only the right password', async () => {
    const a = await hashPassword('meadow sweet 42');
    const b = await hashPassword('meadow sweet 42');
    expect(a).not.toBe(b);
    expect(a.startsWith('scrypt$')).toBe(true);
    expect(await verifyPassword('meadow sweet 42', a)).toBe(true);
    expect(await verifyPassword('meadow sweet 43', a)).toBe(false);
    expect(await verifyPassword('anything', null)).toBe(false);
  });
  it('stores only a digest of e-mailed tokens', () => {
    const { token, tokenHash } = newToken();
    expect(token.length).toBeGreaterThanOrEqual(40);
    expect(tokenHash).toBe(sha256(token));
    expect(tokenHash).not.toContain(token);
  });
});
