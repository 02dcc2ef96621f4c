import { describe, expect, it } from 'vitest';
import { LAB_FILE_MAX_BYTES, labFileRefusal, sniffLabFileType } from '@/lib/domain/file-type';

const bytes = (...parts: (number[] | string)[]) =>
  new Uint8Array(parts.flatMap((p) => (typeof p === 'string' ? [...p].map((c) => c.charCodeAt(0)) : p)));

describe('sniffLabFileType reads the signature, not the name', () => {
  it('PDF: "%PDF-" (ISO 32000-1 §7.5.2)', () => expect(sniffLabFileType(bytes('%PDF-1.7\n'))).toBe('application/pdf'));
  it('PNG: 89 50 4E 47 0D 0A 1A 0A (PNG spec §5.2)', () =>
    expect(sniffLabFileType(bytes([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0]))).toBe('image/png'));
  it('JPEG: FF D8 FF (SOI marker)', () => expect(sniffLabFileType(bytes([0xff, 0xd8, 0xff, 0xe0]))).toBe('image/jpeg'));
  it('WebP: RIFF….WEBP (RIFF container)', () =>
    expect(sniffLabFileType(bytes('RIFF', [1, 2, 3, 4], 'WEBPVP8 '))).toBe('image/webp'));
  it('a RIFF that is not WebP (e.g. WAVE) is refused', () =>
    expect(sniffLabFileType(bytes('RIFF', [1, 2, 3, 4], 'WAVEfmt '))).toBeNull());
  it('a truncated PNG signature is refused', () => expect(sniffLabFileType(bytes([0x89, 0x50, 0x4e]))).toBeNull());
});

describe('labFileRefusal says why', () => {
  it('HTML named .pdf is refused as markup', () =>
    expect(labFileRefusal(bytes('<!DOCTYPE html><html><script>alert(1)</script>'))).toMatch(/web page/));
  it('SVG is refused by name', () =>
    expect(labFileRefusal(bytes('<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg"/>'))).toMatch(/SVG/));
  it('a zip is refused', () =>
    expect(labFileRefusal(bytes('PK', [3, 4, 0, 0]))).toMatch(/not a PDF, PNG, JPEG or WebP/));
  it('an empty file is refused', () => expect(labFileRefusal(new Uint8Array())).toMatch(/empty/));
  it('over 10 MB is refused, exactly 10 MB is not', () => {
    const big = new Uint8Array(LAB_FILE_MAX_BYTES + 1);
    big.set(bytes('%PDF-'));
    expect(labFileRefusal(big)).toMatch(/10 MB/);
    expect(labFileRefusal(big.subarray(0, LAB_FILE_MAX_BYTES))).toBeNull();
  });
});
