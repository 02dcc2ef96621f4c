/** The smallest real files the upload checks accept: a 1×1 PNG and a minimal PDF (magic bytes and all). */
export const TINY_PNG = new Uint8Array(
  Buffer.from(
    '89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d49444154789c6360000000000005000177a4b6a10000000049454e44ae426082',
    'hex',
  ),
);
export const TINY_PDF = new TextEncoder().encode('%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n');
