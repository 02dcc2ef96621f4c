/**
 * The Content-Security-Policy of every page (ASVS 3.4.3): scripts only with this response's nonce
 * ('strict-dynamic' lets those load Next's chunks), no plugins, no framing.
 */
export function contentSecurityPolicy(nonce: string): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'`,
    // Inline style attributes (charts, React style props) are allowed; scripts are not.
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "frame-src 'self'",
    "frame-ancestors 'none'",
    "object-src 'none'",
    "base-uri 'self'",
  ].join('; ');
}

/** A fresh, unpredictable nonce (122 random bits from a v4 UUID, base64). */
export function newNonce(): string {
  return Buffer.from(crypto.randomUUID()).toString('base64');
}

/** The nonce a policy carries, or null. */
export function nonceOf(policy: string | null): string | null {
  return policy?.match(/'nonce-([A-Za-z0-9+/=]+)'/)?.[1] ?? null;
}
