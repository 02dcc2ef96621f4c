import { describe, expect, it } from 'vitest';
import { safeAuthRedirect, safeRedirectPath } from '@/lib/http/redirect-target';

// Each payload is what the sign-in page receives in `next` after the query string is decoded.
const ELSEWHERE = [
  '/\\127.0.0.1:1080/', // ?next=/%5C127.0.0.1:1080/
  '/\t/127.0.0.1:1080/', // ?next=/%09/127.0.0.1:1080/
  '/\\evil',
  '\\\\evil',
  '/\t/evil',
  '/\n/evil',
  '/\r\n/evil',
  '//evil',
  '///evil',
  '/.//evil', // the parser makes this `//evil`
  '/./\\evil',
  '/%2F%2Fevil',
  '/%5Cevil',
  'https://evil.example/',
  'http:/evil.example',
  'javascript:alert(1)',
  'JaVaScRiPt:alert(1)',
  ' javascript:alert(1)',
  'data:text/html,<script>alert(1)</script>',
  'evil.example',
  '',
  '/api/auth/signout',
  '/_next/static/x.js',
];

describe('open redirect after sign-in', () => {
  it.each(ELSEWHERE)('sends %j to the role home instead', (next) => {
    expect(safeRedirectPath(next)).toBe('/welcome');
  });

  it('never answers anything a browser would read as another origin', () => {
    for (const next of ELSEWHERE) {
      const target = new URL(safeRedirectPath(next), 'https://shop.example');
      expect(target.origin).toBe('https://shop.example');
    }
  });

  it('refuses what is not a string (a repeated ?next=)', () => {
    expect(safeRedirectPath(['/admin', '//evil'])).toBe('/welcome');
    expect(safeRedirectPath(undefined)).toBe('/welcome');
  });

  it('keeps our own paths with their query and fragment', () => {
    expect(safeRedirectPath('/admin/lots?page=2#top')).toBe('/admin/lots?page=2#top');
    expect(safeRedirectPath('/checkout')).toBe('/checkout');
    expect(safeRedirectPath('/admin/../account')).toBe('/account');
    expect(safeRedirectPath('/', '/account')).toBe('/');
  });

  it("next-auth's redirect callback keeps same-origin URLs only", () => {
    const base = 'https://shop.example';
    expect(safeAuthRedirect('/account', base)).toBe('https://shop.example/account');
    expect(safeAuthRedirect('https://shop.example/admin?x=1', base)).toBe('https://shop.example/admin?x=1');
    expect(safeAuthRedirect('https://evil.example/', base)).toBe('https://shop.example/welcome');
    expect(safeAuthRedirect('/\\evil.example', base)).toBe('https://shop.example/welcome');
    expect(safeAuthRedirect('//evil.example', base)).toBe('https://shop.example/welcome');
    expect(safeAuthRedirect('javascript:alert(1)', base)).toBe('https://shop.example/welcome');
  });
});
