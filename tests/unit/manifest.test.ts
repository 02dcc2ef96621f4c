import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import { ICON_FILES, iconPixels, type IconKind } from '@/lib/ops/icons';
import { config as proxyConfig } from '@/proxy';

const root = fileURLToPath(new URL('../..', import.meta.url));
const publicFile = (url: string) => path.join(root, 'public', url.replace(/^\//, ''));

type ManifestIcon = { src: string; sizes: string; type: string; purpose?: string };
const manifest = JSON.parse(readFileSync(publicFile('/manifest.webmanifest'), 'utf8')) as {
  name: string;
  short_name: string;
  start_url: string;
  display: string;
  theme_color: string;
  background_color: string;
  icons: ManifestIcon[];
};

/** Width and height from a PNG's IHDR chunk, which always comes first. */
function pngSize(file: Buffer): { width: number; height: number } {
  expect(file.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  expect(file.toString('latin1', 12, 16)).toBe('IHDR');
  return { width: file.readUInt32BE(16), height: file.readUInt32BE(20) };
}

/** The PNG images in an .ico, each checked against the size its directory entry states. */
function icoImages(ico: Buffer): Buffer[] {
  expect([ico.readUInt16LE(0), ico.readUInt16LE(2)]).toEqual([0, 1]);
  return Array.from({ length: ico.readUInt16LE(4) }, (_, i) => {
    const at = 6 + 16 * i;
    const png = ico.subarray(ico.readUInt32LE(at + 12), ico.readUInt32LE(at + 12) + ico.readUInt32LE(at + 8));
    expect(pngSize(png)).toEqual({ width: ico[at] || 256, height: ico[at + 1] || 256 });
    return png;
  });
}

describe('web app manifest', () => {
  it('names the app, starts at /admin and uses the palette', () => {
    expect(manifest).toMatchObject({ name: 'Combtrace', start_url: '/admin', display: 'standalone' });
    expect(manifest.short_name.length).toBeLessThanOrEqual(12);
    const tailwind = readFileSync(path.join(root, 'tailwind.config.ts'), 'utf8');
    for (const colour of [manifest.theme_color, manifest.background_color]) expect(tailwind).toContain(`'${colour}'`);
    // The browser bar matches the installed app.
    expect(readFileSync(path.join(root, 'app/layout.tsx'), 'utf8')).toContain(`themeColor: '${manifest.theme_color}'`);
  });

  it('every icon it names exists with the stated size and type; one is maskable', () => {
    expect(manifest.icons.length).toBeGreaterThan(0);
    for (const icon of manifest.icons) {
      const file = readFileSync(publicFile(icon.src));
      if (icon.type === 'image/svg+xml') {
        expect(icon.sizes).toBe('any');
        expect(file.toString('utf8')).toMatch(/^<svg [^>]*viewBox="0 0 \d+ \d+"/);
        continue;
      }
      expect(icon.type).toBe('image/png');
      const [width, height] = icon.sizes.split('x').map(Number);
      expect(pngSize(file), icon.src).toEqual({ width, height });
    }
    const sizes = (purpose: string) =>
      manifest.icons.filter((i) => (i.purpose ?? 'any').split(' ').includes(purpose)).map((i) => i.sizes);
    expect(sizes('any')).toEqual(expect.arrayContaining(['192x192', '512x512']));
    expect(sizes('maskable')).toContain('512x512');
  });

  it('the icons the layout links exist: the favicon (16, 32 and 48 px PNGs in an .ico) and the 180 px apple-touch-icon', () => {
    const layout = readFileSync(path.join(root, 'app/layout.tsx'), 'utf8');
    const linked = [...layout.matchAll(/'(\/(?:icons\/[^']+|favicon\.ico|manifest\.webmanifest))'/g)].map((m) => m[1]);
    expect(linked).toEqual(
      expect.arrayContaining([
        '/favicon.ico',
        '/icons/icon.svg',
        '/icons/apple-touch-icon.png',
        '/manifest.webmanifest',
      ]),
    );
    for (const url of linked) expect(existsSync(publicFile(url)), url).toBe(true);
    expect(pngSize(readFileSync(publicFile('/icons/apple-touch-icon.png')))).toEqual({ width: 180, height: 180 });

    const ico = readFileSync(publicFile('/favicon.ico'));
    expect(icoImages(ico).map(pngSize)).toEqual([16, 32, 48].map((n) => ({ width: n, height: n })));
  });

  it('the committed icons are what lib/ops/icons.ts draws (run `npm run icons` after changing it)', () => {
    for (const { file, make } of ICON_FILES) {
      const committed = readFileSync(publicFile(file));
      const made = make();
      if (typeof made === 'string') {
        expect(committed.toString('utf8'), file).toBe(made);
      } else {
        // Compare pixels, not bytes: another zlib may compress the same pixels differently.
        const kind: IconKind = file.includes('maskable') || file.includes('apple') ? 'full' : 'any';
        for (const image of file.endsWith('.ico') ? icoImages(committed) : [committed]) {
          const png = PNG.sync.read(image);
          expect(Buffer.from(png.data).equals(Buffer.from(iconPixels(kind, png.width))), `${file} ${png.width}px`).toBe(
            true,
          );
        }
      }
    }
  });

  it('signed-out visitors get the manifest and icons as plain files: the proxy (sign-in redirect, CSP) does not run for them', () => {
    const urls = [
      '/manifest.webmanifest',
      '/favicon.ico',
      ...manifest.icons.map((i) => i.src),
      '/icons/apple-touch-icon.png',
    ];
    const matchers = proxyConfig.matcher.map((m) => new RegExp(`^${m.source}$`));
    for (const url of urls)
      expect(
        matchers.some((re) => re.test(url)),
        url,
      ).toBe(false);
    // …while pages still go through it.
    expect(matchers.some((re) => re.test('/admin'))).toBe(true);
    expect(matchers.some((re) => re.test('/products/heather'))).toBe(true);
  });
});
