import 'server-only';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import fontkit from '@pdf-lib/fontkit';
import type { PDFDocument, PDFFont } from 'pdf-lib';

/**
 * Lora for PDFs. The @expo-google-fonts TTFs embed cleanly with subsetting; the
 * @fontsource WOFF/WOFF2 files do not (a blank page, a crash, or Latin only). Paths assume cwd = project root.
 */
const FILES = {
  400: 'node_modules/@expo-google-fonts/lora/400Regular/Lora_400Regular.ttf',
  700: 'node_modules/@expo-google-fonts/lora/700Bold/Lora_700Bold.ttf',
} as const;

export type LoraWeight = keyof typeof FILES;

const fileBytes = new Map<LoraWeight, Promise<Uint8Array>>();
const embedded = new WeakMap<PDFDocument, Map<LoraWeight, Promise<PDFFont>>>();

function loraBytes(weight: LoraWeight): Promise<Uint8Array> {
  let bytes = fileBytes.get(weight);
  if (!bytes) {
    bytes = readFile(path.join(process.cwd(), FILES[weight])).then((b) => new Uint8Array(b));
    bytes.catch(() => fileBytes.delete(weight));
    fileBytes.set(weight, bytes);
  }
  return bytes;
}

/** Embeds (once per document) a subset of Lora at the given weight. */
export function embedLora(doc: PDFDocument, weight: LoraWeight): Promise<PDFFont> {
  let fonts = embedded.get(doc);
  if (!fonts) {
    doc.registerFontkit(fontkit);
    fonts = new Map();
    embedded.set(doc, fonts);
  }
  let font = fonts.get(weight);
  if (!font) {
    font = loraBytes(weight).then((bytes) => doc.embedFont(bytes, { subset: true }));
    fonts.set(weight, font);
  }
  return font;
}

/**
 * Removes characters that should never reach a PDF text run: C0/C1 controls (which
 * include line breaks; callers wrap text themselves) become spaces, runs of
 * whitespace collapse to one.
 */
export function cleanText(text: string): string {
  return text
    .replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}
