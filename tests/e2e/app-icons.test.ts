import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { BASE } from './support';

// The web app manifest and the icons reach a signed-out visitor as plain files from public/:
// no sign-in redirect, no proxy on the way (so no CSP header), and every page's head links them.

const manifest = JSON.parse(readFileSync('public/manifest.webmanifest', 'utf8')) as {
  icons: { src: string; type: string }[];
};

describe('web app manifest and icons, signed out', () => {
  it('serves the manifest and each icon it names, untouched by the proxy', async () => {
    const res = await fetch(`${BASE()}/manifest.webmanifest`, { redirect: 'manual' });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/json/);
    expect(res.headers.get('content-security-policy')).toBeNull();
    expect(await res.json()).toMatchObject({ name: 'Combtrace', start_url: '/admin' });
    const files = [
      ...manifest.icons.map((i) => [i.src, i.type]),
      ['/favicon.ico', 'image/x-icon'],
      ['/icons/apple-touch-icon.png', 'image/png'],
    ];
    for (const [src, type] of files) {
      const icon = await fetch(`${BASE()}${src}`, { redirect: 'manual' });
      expect(icon.status, src).toBe(200);
      expect(icon.headers.get('content-type'), src).toContain(type.replace('image/x-icon', 'image/'));
      expect(icon.headers.get('content-security-policy'), src).toBeNull();
    }
  });

  it('links the manifest, the icons and the theme colour from the page head', async () => {
    const html = await (await fetch(`${BASE()}/sign-in`)).text();
    expect(html).toMatch(/<link rel="manifest" href="\/manifest.webmanifest"/);
    expect(html).toMatch(/<link rel="icon" href="\/favicon.ico"/);
    expect(html).toMatch(/<link rel="icon" href="\/icons\/icon.svg" type="image\/svg\+xml"/);
    expect(html).toMatch(/<link rel="apple-touch-icon" href="\/icons\/apple-touch-icon.png" sizes="180x180"/);
    expect(html).toMatch(/<meta name="theme-color" content="#1b3a2a"/);
  });
});
