import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

/** poppler-utils present? (apt-get install -y poppler-utils.) */
export const hasPoppler = !spawnSync('pdftotext', ['-v']).error && !spawnSync('pdftoppm', ['-v']).error;
if (!hasPoppler)
  console.warn(
    'poppler-utils (pdftotext, pdftoppm) not found: PDF text and raster checks are skipped. Install with apt-get install -y poppler-utils.',
  );

function tempPdf(bytes: Uint8Array): { dir: string; file: string } {
  const dir = mkdtempSync(path.join(tmpdir(), 'combtrace-pdf-'));
  const file = path.join(dir, 'doc.pdf');
  writeFileSync(file, bytes);
  return { dir, file };
}

/** The PDF's text as pdftotext reads it (reading order, no layout). */
export function pdfText(bytes: Uint8Array): string {
  const { file } = tempPdf(bytes);
  return execFileSync('pdftotext', ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' });
}

/** Page 1 rasterised at `dpi` as a PNG. */
export function pdfPagePng(bytes: Uint8Array, dpi: number): Buffer {
  const { dir, file } = tempPdf(bytes);
  execFileSync('pdftoppm', ['-r', String(dpi), '-png', '-f', '1', '-l', '1', file, path.join(dir, 'page')]);
  const png = readdirSync(dir).find((f) => f.startsWith('page') && f.endsWith('.png'));
  if (!png) throw new Error('pdftoppm wrote no page');
  return readFileSync(path.join(dir, png));
}
