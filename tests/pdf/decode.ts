import zxing from '@zxing/library';
import { PNG } from 'pngjs';

/** Decodes a PNG with @zxing/library: RGBA → luminance → HybridBinarizer → the reader for the symbology. */
export function decodePng(png: Buffer, kind: 'code128' | 'datamatrix' | 'qr'): string {
  const image = PNG.sync.read(png);
  const luminance = new Uint8ClampedArray(image.width * image.height);
  for (let i = 0; i < luminance.length; i++) {
    const [r, g, b, a] = [image.data[i * 4], image.data[i * 4 + 1], image.data[i * 4 + 2], image.data[i * 4 + 3]];
    // Composite over white so a transparent background reads as paper, not ink.
    const alpha = a / 255;
    luminance[i] = Math.round(((r * 299 + g * 587 + b * 114) / 1000) * alpha + 255 * (1 - alpha));
  }
  const source = new zxing.RGBLuminanceSource(luminance, image.width, image.height);
  const bitmap = new zxing.BinaryBitmap(new zxing.HybridBinarizer(source));
  const hints = new Map<zxing.DecodeHintType, unknown>([
    [zxing.DecodeHintType.ASSUME_GS1, true],
    [zxing.DecodeHintType.TRY_HARDER, true],
  ]);
  const reader =
    kind === 'code128'
      ? new zxing.Code128Reader()
      : kind === 'datamatrix'
        ? new zxing.DataMatrixReader()
        : new zxing.QRCodeReader();
  const text = reader.decode(bitmap, hints).getText();
  // @zxing/library 0.21 reads a Code 128 check character of value 102 in code set C as FNC1 and
  // appends a GS after the data (seen with lot TJ-UDJD30). A GS1 element string never ends with a
  // separator (GS1 General Specifications, FNC1 only between fields), so a trailing one is dropped.
  return kind === 'code128' ? text.replace(/\x1d$/, '') : text;
}

/** Cuts a rectangle (in PDF points, measured from the top-left) out of a page rendered at `dpi`, with a white margin. */
export function cropPng(
  png: Buffer,
  dpi: number,
  box: { x: number; top: number; width: number; height: number },
  marginPt = 4,
): Buffer {
  const page = PNG.sync.read(png);
  const px = (pt: number) => Math.round((pt * dpi) / 72);
  const x0 = Math.max(0, px(box.x - marginPt));
  const y0 = Math.max(0, px(box.top - marginPt));
  const x1 = Math.min(page.width, px(box.x + box.width + marginPt));
  const y1 = Math.min(page.height, px(box.top + box.height + marginPt));
  const out = new PNG({ width: x1 - x0, height: y1 - y0 });
  PNG.bitblt(page, out, x0, y0, x1 - x0, y1 - y0, 0, 0);
  return PNG.sync.write(out);
}
