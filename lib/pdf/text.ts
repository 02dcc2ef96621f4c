import 'server-only';
import type { PDFFont } from 'pdf-lib';

/** Line advance as a multiple of the font size (common practice for small print). */
export const LINE_HEIGHT = 1.18;

const widthCache = new WeakMap<PDFFont, Map<string, number>>();
const WIDTH_CACHE_LIMIT = 20_000;

/**
 * Advance width of text at a size. pdf-lib lays text out with fontkit on every call
 * (slow for thousands of labels) and sums plain advance widths, so the width at size 1
 * is cached per font and scaled.
 */
export function textWidth(font: PDFFont, text: string, size: number): number {
  let cache = widthCache.get(font);
  if (!cache) {
    cache = new Map();
    widthCache.set(font, cache);
  }
  let unit = cache.get(text);
  if (unit === undefined) {
    unit = font.widthOfTextAtSize(text, 1);
    if (cache.size >= WIDTH_CACHE_LIMIT) cache.clear();
    cache.set(text, unit);
  }
  return unit * size;
}

/** Breaks text into lines no wider than maxWidth; words wider than a line are split. */
export function wrapText(text: string, font: PDFFont, size: number, maxWidth: number): string[] {
  const lines: string[] = [];
  let line = '';
  let lineWidth = 0;
  const width = (s: string) => textWidth(font, s, size);
  const space = width(' ');
  for (const word of text.split(' ').filter(Boolean)) {
    const wordWidth = width(word);
    // Advance widths add up (no kerning across a space), so words are measured once.
    const candidateWidth = line ? lineWidth + space + wordWidth : wordWidth;
    if (candidateWidth <= maxWidth) {
      line = line ? `${line} ${word}` : word;
      lineWidth = candidateWidth;
      continue;
    }
    if (line) lines.push(line);
    line = '';
    lineWidth = 0;
    if (wordWidth <= maxWidth) {
      line = word;
      lineWidth = wordWidth;
      continue;
    }
    // A single word too wide for the line (a long lot code, a URL): split by character.
    let piece = '';
    for (const ch of Array.from(word)) {
      if (piece && width(piece + ch) > maxWidth) {
        lines.push(piece);
        piece = '';
      }
      piece += ch;
    }
    line = piece;
    lineWidth = width(piece);
  }
  if (line) lines.push(line);
  return lines;
}

/** Shortens a line with "…" until it fits maxWidth (always ends in "…" when forced). */
export function ellipsize(line: string, font: PDFFont, size: number, maxWidth: number, force = false): string {
  if (!force && textWidth(font, line, size) <= maxWidth) return line;
  const chars = Array.from(line);
  while (chars.length > 0 && font.widthOfTextAtSize(`${chars.join('').trimEnd()}…`, size) > maxWidth) chars.pop();
  return `${chars.join('').trimEnd()}…`;
}

export type TextBlock = {
  text: string;
  font: PDFFont;
  size: number;
  minSize: number;
  maxLines: number;
  /** Given up first (higher first) when even the smallest sizes do not fit; 0 = never. */
  dropPriority?: number;
};

export type FittedBlock = { lines: string[]; font: PDFFont; size: number };

function layoutAt(
  blocks: TextBlock[],
  scale: number,
  width: number,
  maxLines: number[],
): { fitted: FittedBlock[]; height: number; truncated: boolean } {
  let height = 0;
  let truncated = false;
  const fitted = blocks.map((block, i) => {
    const size = Math.max(block.minSize, block.size * scale);
    let lines = maxLines[i] > 0 ? wrapText(block.text, block.font, size, width) : [];
    if (lines.length > maxLines[i]) {
      truncated = true;
      lines = lines.slice(0, maxLines[i]);
      if (lines.length > 0) lines[lines.length - 1] = ellipsize(lines[lines.length - 1], block.font, size, width, true);
    }
    height += lines.length * size * LINE_HEIGHT;
    return { lines, font: block.font, size };
  });
  return { fitted, height, truncated };
}

/**
 * Largest scale (from maxScale down to the blocks' minimum sizes) at which the blocks
 * fit the box. If even the minimum sizes overflow, blocks with a drop priority lose
 * lines, then disappear; `overflow` tells the caller anything is still too tall.
 */
export function fitBlocks(
  blocks: TextBlock[],
  width: number,
  height: number,
  maxScale = 1,
): { blocks: FittedBlock[]; overflow: boolean } {
  const maxLines = blocks.map((b) => b.maxLines);
  const attempts: ReturnType<typeof layoutAt>[] = [];
  for (let scale = maxScale; scale > 0.3; scale -= 0.05) {
    const attempt = layoutAt(blocks, scale, width, maxLines);
    // Shrinking beats cutting text short: take the largest scale that shows everything.
    if (attempt.height <= height && !attempt.truncated) return { blocks: attempt.fitted, overflow: false };
    attempts.push(attempt);
    if (blocks.every((b) => b.size * scale <= b.minSize)) break;
  }
  const shortened = attempts.find((a) => a.height <= height);
  if (shortened) return { blocks: shortened.fitted, overflow: false };
  const order = blocks
    .map((b, i) => ({ i, priority: b.dropPriority ?? 0 }))
    .filter((b) => b.priority > 0)
    .sort((a, b) => b.priority - a.priority);
  for (const { i } of order) {
    while (maxLines[i] > 0) {
      maxLines[i] -= 1;
      const attempt = layoutAt(blocks, 0, width, maxLines);
      if (attempt.height <= height) return { blocks: attempt.fitted, overflow: false };
    }
  }
  return { blocks: layoutAt(blocks, 0, width, maxLines).fitted, overflow: true };
}
