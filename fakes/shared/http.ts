// Small helpers shared by the local Stripe and mail fakes: plain Node `http`, no framework.
import type { IncomingMessage, Server, ServerResponse } from 'node:http';
import type { AddressInfo, Server as NetServer } from 'node:net';

/** Both fakes bind to loopback only: nothing here is meant to be reachable from outside. */
export const LOOPBACK = '127.0.0.1';

export class BodyTooLargeError extends Error {}

/** Reads the raw body; the Stripe fake needs the exact bytes for idempotency comparisons. */
export async function readBody(req: IncomingMessage, limitBytes = 1_000_000): Promise<string> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of req) {
    const buf = Buffer.isBuffer(chunk) ? chunk : Buffer.from(String(chunk));
    size += buf.length;
    if (size > limitBytes) throw new BodyTooLargeError(`Body larger than ${limitBytes} bytes`);
    chunks.push(buf);
  }
  return Buffer.concat(chunks).toString('utf8');
}

export function sendJson(
  res: ServerResponse,
  status: number,
  body: unknown,
  headers: Record<string, string> = {},
): void {
  const text = JSON.stringify(body, null, 2);
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers });
  res.end(text);
}

/** Pages never run scripts; the CSP also covers `srcdoc` iframes, which inherit the parent's policy. */
export function sendHtml(res: ServerResponse, status: number, html: string): void {
  res.writeHead(status, {
    'content-type': 'text/html; charset=utf-8',
    'cache-control': 'no-store',
    'content-security-policy':
      "default-src 'none'; style-src 'unsafe-inline'; img-src * data:; form-action *; frame-src 'self'",
  });
  res.end(html);
}

export function redirect(res: ServerResponse, status: 302 | 303, location: string): void {
  res.writeHead(status, { location, 'cache-control': 'no-store' });
  res.end();
}

/** Everything user- or mail-supplied goes through this before it reaches HTML (text and attribute context). */
export function escapeHtml(value: unknown): string {
  return String(value ?? '')
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;');
}

export function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>body{font:16px/1.5 system-ui,sans-serif;margin:2rem auto;max-width:60rem;padding:0 1rem;color:#1d1d1b}
table{border-collapse:collapse;width:100%}th,td{border-bottom:1px solid #ccc;padding:.35rem;text-align:left;vertical-align:top}
label{display:block;margin-top:.75rem;font-weight:600}input{font:inherit;padding:.4rem;width:100%;max-width:22rem}
button{font:inherit;margin-top:1rem;padding:.5rem 1.25rem}.error{color:#a40000;font-weight:600}
code{font-size:.9em}iframe{width:100%;min-height:30rem;border:1px solid #ccc}</style></head>
<body>${body}</body></html>`;
}

/** Listens on loopback and resolves with the bound port (0 = ephemeral, for tests). */
export function listen(server: NetServer, port: number): Promise<number> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, LOOPBACK, () => {
      server.off('error', reject);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

/** Keep-alive sockets would otherwise hold `close()` open until they time out. */
export function closeServer(server: Server): Promise<void> {
  return new Promise((resolve, reject) => {
    server.close((err) => (err ? reject(err) : resolve()));
    server.closeAllConnections();
  });
}
