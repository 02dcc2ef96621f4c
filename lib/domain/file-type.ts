/**
 * The type of an uploaded file (lab reports, product photos), read from the file's first bytes ("magic numbers"),
 * never from its name or the browser's claim: a file named report.pdf that is HTML is refused.
 * Signatures: PDF "%PDF-" (ISO 32000-1 §7.5.2); PNG 89 50 4E 47 0D 0A 1A 0A (PNG spec §5.2);
 * JPEG FF D8 FF (JFIF/Exif SOI marker); WebP "RIFF" size "WEBP" (RIFF container, WebP spec).
 */

export const LAB_FILE_TYPES = ['application/pdf', 'image/png', 'image/jpeg', 'image/webp'] as const;
export type LabFileType = (typeof LAB_FILE_TYPES)[number];
export const LAB_FILE_MAX_BYTES = 10 * 1024 * 1024;

function startsWith(bytes: Uint8Array, signature: number[], offset = 0): boolean {
  if (bytes.length < offset + signature.length) return false;
  return signature.every((b, i) => bytes[offset + i] === b);
}

const ascii = (text: string) => [...text].map((c) => c.charCodeAt(0));

/** The content type a file really is, or null when it is none of the accepted kinds. */
export function sniffLabFileType(bytes: Uint8Array): LabFileType | null {
  if (startsWith(bytes, ascii('%PDF-'))) return 'application/pdf';
  if (startsWith(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'image/png';
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return 'image/jpeg';
  if (startsWith(bytes, ascii('RIFF')) && startsWith(bytes, ascii('WEBP'), 8)) return 'image/webp';
  return null;
}

export type ImageFileType = Exclude<LabFileType, 'application/pdf'>;

/** The same signatures, images only: product photos are JPEG, PNG or WebP. */
export function sniffImageType(bytes: Uint8Array): ImageFileType | null {
  const type = sniffLabFileType(bytes);
  return type === 'application/pdf' ? null : type;
}

/** A plain sentence saying why a file is refused, or null when it is accepted. */
export function labFileRefusal(bytes: Uint8Array): string | null {
  if (bytes.length === 0) return 'The file is empty.';
  if (bytes.length > LAB_FILE_MAX_BYTES) return 'The file is larger than 10 MB.';
  if (sniffLabFileType(bytes)) return null;
  const head = new TextDecoder('utf-8', { fatal: false }).decode(bytes.slice(0, 512)).trimStart().toLowerCase();
  if (head.startsWith('<svg') || (head.startsWith('<?xml') && head.includes('<svg')))
    return 'SVG images are not accepted: upload a PDF, PNG, JPEG or WebP file.';
  if (head.startsWith('<!doctype html') || head.startsWith('<html') || head.startsWith('<'))
    return 'This file is a web page or markup, not a lab report: upload a PDF, PNG, JPEG or WebP file.';
  return 'This file is not a PDF, PNG, JPEG or WebP file (checked from its content, not its name).';
}
