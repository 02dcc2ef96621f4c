import 'server-only';

const CHUNK_BYTES = 64 * 1024;

/**
 * A safe ASCII file name for Content-Disposition (RFC 6266 §4.3): letters, digits,
 * dot, dash and underscore only, ending in ".pdf", at most 100 characters.
 */
export function safePdfFilename(filename: string): string {
  const stem = filename
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '') // drop accents left by NFKD: "Łódź" → "Lodz" where possible
    .replace(/\.pdf$/i, '')
    .replace(/[^A-Za-z0-9._-]+/g, '_')
    .replace(/^[._]+|[._]+$/g, '')
    .slice(0, 96);
  return `${stem || 'document'}.pdf`;
}

/** Streams PDF bytes as a download; private and never cached (a label sheet can hold customer data). */
export function pdfResponse(bytes: Uint8Array, filename: string): Response {
  let offset = 0;
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (offset >= bytes.byteLength) {
        controller.close();
        return;
      }
      const end = Math.min(offset + CHUNK_BYTES, bytes.byteLength);
      controller.enqueue(bytes.slice(offset, end));
      offset = end;
    },
  });
  return new Response(body, {
    status: 200,
    headers: {
      'Content-Type': 'application/pdf',
      'Content-Length': String(bytes.byteLength),
      'Content-Disposition': `attachment; filename="${safePdfFilename(filename)}"`,
      'Cache-Control': 'private, no-store',
      'X-Content-Type-Options': 'nosniff',
    },
  });
}
