import { describe, expect, it } from 'vitest';
import { appUrl } from '@/lib/config/app-url';

describe('appUrl: the one public base URL for links we send out', () => {
  it('a reset link has no double slash when APP_URL ends with /', () => {
    const link = `${appUrl({ APP_URL: 'https://honey.example/' })}/reset-password?token=abc`;
    expect(link).toBe('https://honey.example/reset-password?token=abc');
    expect(`${appUrl({ APP_URL: 'https://honey.example/shop//' })}/reset-password`).toBe(
      'https://honey.example/shop/reset-password',
    );
  });

  it('takes APP_URL, then NEXTAUTH_URL, then the local default; an empty variable counts as unset', () => {
    expect(appUrl({ APP_URL: 'https://a.example', NEXTAUTH_URL: 'https://b.example' })).toBe('https://a.example');
    expect(appUrl({ NEXTAUTH_URL: 'https://b.example/' })).toBe('https://b.example');
    expect(appUrl({ APP_URL: '', NEXTAUTH_URL: 'https://b.example' })).toBe('https://b.example');
    expect(appUrl({})).toBe('http://127.0.0.1:3100');
  });
});
