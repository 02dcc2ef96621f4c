import 'server-only';
import bwipjs from 'bwip-js/node';
import { gs1RawElementString } from '@/lib/domain/gs1';

/**
 * Barcode PNGs (bwip-js). A small in-memory LRU cache keeps each distinct symbol,
 * so a sheet of a thousand labels from fifty lots encodes fifty barcodes.
 */

export type Gs1BarcodeKind = 'gs1-128' | 'gs1datamatrix';
/**
 * includeText: human-readable line under a linear symbol (default true).
 * scale: pixels per module (default 3 linear, 4 two-dimensional).
 * barHeightMm: bar height of a linear symbol at 72 dpi × scale (default 12). A PDF
 * stretches a linear symbol's image to any height without loss, so it asks for 1.
 */
export type BarcodeOptions = { includeText?: boolean; scale?: number; barHeightMm?: number };

function linear(options: BarcodeOptions) {
  const scale = options.scale ?? 3;
  const includeText = options.includeText ?? true;
  // Separate x and y scales keep a short strip short when bars are only stretched later.
  return {
    scaleX: scale,
    scaleY: includeText ? scale : 1,
    height: options.barHeightMm ?? 12,
    includetext: includeText,
    paddingwidth: 10,
    paddingheight: 1,
  };
}

const CACHE_LIMIT = 500;
const cache = new Map<string, Promise<Buffer>>();

function cached(key: string, make: () => Promise<Buffer>): Promise<Buffer> {
  const hit = cache.get(key);
  if (hit) {
    cache.delete(key); // re-insert: Map keeps insertion order, oldest first
    cache.set(key, hit);
    return hit;
  }
  const made = make();
  made.catch(() => cache.delete(key)); // do not keep failures
  cache.set(key, made);
  if (cache.size > CACHE_LIMIT) cache.delete(cache.keys().next().value as string);
  return made;
}

// Opaque white background: a transparent PNG reads as black to decoders that ignore alpha.
const common = { backgroundcolor: 'FFFFFF', barcolor: '000000' } as const;

/**
 * GS1-128 or GS1 DataMatrix from a bracketed element string such as
 * `(01)09521234543213(15)271231(10)HH26-014` (bwip-js inserts FNC1 where needed).
 * Quiet zones (GS1 General Specifications §5.4.4.2, §5.6.3.2, from memory): 10 modules
 * each side for GS1-128, 1 module for DataMatrix; bwip-js pads in modules × scale.
 */
export function gs1BarcodePng(
  elementString: string,
  kind: Gs1BarcodeKind,
  options: BarcodeOptions = {},
): Promise<Buffer> {
  const includeText = options.includeText ?? true;
  return cached(`${kind}\0${JSON.stringify(options)}\0${elementString}`, () => {
    // bwip-js cannot take "(" or ")" inside a value (both are in character set 82, so a
    // lot may hold them); then FNC1 is placed by hand: FNC1 first marks the symbol as
    // GS1 (GS1 General Specifications §5.4.3.7 / §5.6.3.1, from memory), GS → FNC1.
    const bracketsInData = /[()]/.test(elementString.replace(/\(\d{2,4}\)/g, ''));
    const text = bracketsInData
      ? `^FNC1${gs1RawElementString(elementString).replaceAll('\x1d', '^FNC1')}`
      : elementString;
    const raw = bracketsInData ? { parsefnc: true } : {};
    return kind === 'gs1-128'
      ? bwipjs.toBuffer({
          ...common,
          ...raw,
          ...linear(options),
          bcid: bracketsInData ? 'code128' : 'gs1-128',
          text,
          ...(bracketsInData && includeText ? { alttext: elementString } : {}),
        })
      : bwipjs.toBuffer({
          ...common,
          ...raw,
          bcid: bracketsInData ? 'datamatrix' : 'gs1datamatrix',
          text,
          scale: options.scale ?? 4,
          padding: 1,
        });
  });
}

/** QR code (ISO/IEC 18004) for a URL or any text; error correction M, 4-module quiet zone. */
export function qrPng(text: string, options: Pick<BarcodeOptions, 'scale'> = {}): Promise<Buffer> {
  const scale = options.scale ?? 4;
  return cached(`qr\0${scale}\0${text}`, () =>
    bwipjs.toBuffer({ ...common, bcid: 'qrcode', text, eclevel: 'M', scale, padding: 4 } as Parameters<
      typeof bwipjs.toBuffer
    >[0]),
  );
}

/** Plain Code 128 (ISO/IEC 15417), e.g. a super tag code; 10-module quiet zones. */
export function code128Png(text: string, options: BarcodeOptions = {}): Promise<Buffer> {
  return cached(`c128\0${JSON.stringify(options)}\0${text}`, () =>
    bwipjs.toBuffer({ ...common, ...linear(options), bcid: 'code128', text }),
  );
}
