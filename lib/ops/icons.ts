/**
 * Combtrace's icon: a deep green hexagon holding three comb cells on a diagonal, two pale and the
 * last one amber (the trace from the hive to the jar). The shapes are defined once, here, and
 * written both as SVG and as PNGs (drawn by the small rasteriser below, with pngjs), so the two
 * always match and nothing has to be downloaded or launched.
 *
 * Run: npm run icons   (writes public/favicon.ico, public/icons/*)
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { PNG } from 'pngjs';

/** The palette (tailwind.config.ts). */
export const ICON_COLOURS = {
  forest800: '#1b3a2a',
  forest700: '#244a36',
  forest100: '#d6e6da',
  amber500: '#d99a1e',
  paper: '#f8f5ee',
} as const;

/** "any": the mark on a transparent ground; "full": edge to edge on green, the mark inside the maskable safe circle. */
export type IconKind = 'any' | 'full';
type Point = [number, number];
type Shape = { points: Point[]; fill: string };

const VIEW = 512;
const CENTRE = VIEW / 2;

/** A regular hexagon with a point at the top, its corners rounded with `round` (in the same units). */
function hexagon(cx: number, cy: number, radius: number, round: number): Point[] {
  const corners: Point[] = Array.from({ length: 6 }, (_, i) => {
    const a = ((-90 + 60 * i) * Math.PI) / 180;
    return [cx + radius * Math.cos(a), cy + radius * Math.sin(a)];
  });
  if (round <= 0) return corners;
  // Each corner (120° inside) becomes an arc tangent to both sides: the arc's centre lies
  // round / sin(60°) from the corner towards the middle, the arc spans 60°.
  const steps = 6;
  const inset = round / Math.sin(Math.PI / 3);
  const points: Point[] = [];
  corners.forEach(([x, y]) => {
    const toward = Math.atan2(cy - y, cx - x);
    const ax = x + inset * Math.cos(toward);
    const ay = y + inset * Math.sin(toward);
    const mid = toward + Math.PI;
    for (let s = 0; s <= steps; s++) {
      const a = mid - Math.PI / 6 + (Math.PI / 3) * (s / steps);
      points.push([ax + round * Math.cos(a), ay + round * Math.sin(a)]);
    }
  });
  return points;
}

/** The shapes of one kind of icon, back to front, in a 512 × 512 box. */
export function iconShapes(kind: IconKind): Shape[] {
  const shapes: Shape[] = [];
  let outer = 248;
  if (kind === 'full') {
    shapes.push({
      points: [
        [0, 0],
        [VIEW, 0],
        [VIEW, VIEW],
        [0, VIEW],
      ],
      fill: ICON_COLOURS.forest800,
    });
    // Inside the maskable safe zone: a circle of 40 % of the width around the centre.
    outer = 196;
    shapes.push({ points: hexagon(CENTRE, CENTRE, outer, 28), fill: ICON_COLOURS.forest700 });
  } else {
    shapes.push({ points: hexagon(CENTRE, CENTRE, outer, 40), fill: ICON_COLOURS.forest800 });
  }
  // Three cells on the up-right diagonal (neighbouring cells of a comb whose cells point up).
  const scale = outer / 248;
  const cell = 64 * scale;
  const step = (Math.sqrt(3) * 64 + 14) * scale;
  const dir: Point = [Math.cos(-Math.PI / 3), Math.sin(-Math.PI / 3)];
  const fills = [ICON_COLOURS.forest100, ICON_COLOURS.forest100, ICON_COLOURS.amber500];
  fills.forEach((fill, i) => {
    const k = i - 1;
    shapes.push({ points: hexagon(CENTRE + k * step * dir[0], CENTRE + k * step * dir[1], cell, 10 * scale), fill });
  });
  return shapes;
}

const fmt = (n: number) => String(Math.round(n * 100) / 100);

/** The icon as an SVG document. */
export function iconSvg(kind: IconKind): string {
  const body = iconShapes(kind)
    .map((s) => `  <polygon fill="${s.fill}" points="${s.points.map(([x, y]) => `${fmt(x)},${fmt(y)}`).join(' ')}"/>`)
    .join('\n');
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${VIEW} ${VIEW}">\n  <title>Combtrace</title>\n${body}\n</svg>\n`;
}

function rgb(hex: string): [number, number, number] {
  const n = parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

/**
 * The icon as RGBA pixels, `size` × `size`. Each shape's coverage of a pixel is exact across and
 * sampled 16 times down; shapes are laid over each other in order.
 */
export function iconPixels(kind: IconKind, size: number): Uint8Array {
  const rows = 16;
  const scale = size / VIEW;
  // Premultiplied colour, 0..1.
  const acc = new Float64Array(size * size * 4);
  const cover = new Float64Array(size * size);
  for (const shape of iconShapes(kind)) {
    cover.fill(0);
    const pts = shape.points.map(([x, y]): Point => [x * scale, y * scale]);
    for (let sy = 0; sy < size * rows; sy++) {
      const y = (sy + 0.5) / rows;
      const row = Math.floor(sy / rows);
      const xs: number[] = [];
      for (let i = 0; i < pts.length; i++) {
        const [x0, y0] = pts[i];
        const [x1, y1] = pts[(i + 1) % pts.length];
        if ((y0 <= y && y < y1) || (y1 <= y && y < y0)) xs.push(x0 + ((y - y0) * (x1 - x0)) / (y1 - y0));
      }
      xs.sort((a, b) => a - b);
      for (let i = 0; i + 1 < xs.length; i += 2) {
        const a = Math.max(0, xs[i]);
        const b = Math.min(size, xs[i + 1]);
        for (let px = Math.floor(a); px < Math.ceil(b); px++) {
          const overlap = Math.min(b, px + 1) - Math.max(a, px);
          if (overlap > 0) cover[row * size + px] += overlap / rows;
        }
      }
    }
    const [r, g, b] = rgb(shape.fill).map((c) => c / 255);
    for (let p = 0; p < size * size; p++) {
      const alpha = Math.min(1, cover[p]);
      if (alpha === 0) continue;
      const keep = 1 - alpha;
      acc[p * 4] = r * alpha + acc[p * 4] * keep;
      acc[p * 4 + 1] = g * alpha + acc[p * 4 + 1] * keep;
      acc[p * 4 + 2] = b * alpha + acc[p * 4 + 2] * keep;
      acc[p * 4 + 3] = alpha + acc[p * 4 + 3] * keep;
    }
  }
  const out = new Uint8Array(size * size * 4);
  for (let p = 0; p < size * size; p++) {
    const a = acc[p * 4 + 3];
    for (let c = 0; c < 3; c++) out[p * 4 + c] = a > 0 ? Math.round((acc[p * 4 + c] / a) * 255) : 0;
    out[p * 4 + 3] = Math.round(a * 255);
  }
  return out;
}

/** The icon as a PNG file. */
export function iconPng(kind: IconKind, size: number): Buffer {
  const png = new PNG({ width: size, height: size });
  png.data = Buffer.from(iconPixels(kind, size));
  return PNG.sync.write(png);
}

/** An .ico holding PNG images (each 256 px or smaller). */
export function icoFile(images: { size: number; png: Buffer }[]): Buffer {
  const head = Buffer.alloc(6 + 16 * images.length);
  head.writeUInt16LE(0, 0);
  head.writeUInt16LE(1, 2); // 1 = icon
  head.writeUInt16LE(images.length, 4);
  let offset = head.length;
  images.forEach(({ size, png }, i) => {
    const at = 6 + 16 * i;
    head.writeUInt8(size % 256, at); // 0 means 256
    head.writeUInt8(size % 256, at + 1);
    head.writeUInt8(0, at + 2); // no palette
    head.writeUInt8(0, at + 3);
    head.writeUInt16LE(1, at + 4); // colour planes
    head.writeUInt16LE(32, at + 6); // bits per pixel
    head.writeUInt32LE(png.length, at + 8);
    head.writeUInt32LE(offset, at + 12);
    offset += png.length;
  });
  return Buffer.concat([head, ...images.map((i) => i.png)]);
}

/** Every file under public/ that this script makes, by path. */
export const ICON_FILES: { file: string; make: () => Buffer | string }[] = [
  { file: 'favicon.ico', make: () => icoFile([16, 32, 48].map((size) => ({ size, png: iconPng('any', size) }))) },
  { file: 'icons/icon.svg', make: () => iconSvg('any') },
  { file: 'icons/icon-maskable.svg', make: () => iconSvg('full') },
  { file: 'icons/icon-192.png', make: () => iconPng('any', 192) },
  { file: 'icons/icon-512.png', make: () => iconPng('any', 512) },
  { file: 'icons/icon-maskable-192.png', make: () => iconPng('full', 192) },
  { file: 'icons/icon-maskable-512.png', make: () => iconPng('full', 512) },
  { file: 'icons/apple-touch-icon.png', make: () => iconPng('full', 180) },
];

if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) {
  const publicDir = fileURLToPath(new URL('../../public/', import.meta.url));
  for (const { file, make } of ICON_FILES) {
    const target = path.join(publicDir, file);
    mkdirSync(path.dirname(target), { recursive: true });
    writeFileSync(target, make());
    console.log(`wrote public/${file}`);
  }
}
