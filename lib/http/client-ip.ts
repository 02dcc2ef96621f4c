/** The client's address: the first X-Forwarded-For hop (set by our load balancer), else "local". */
export function clientIp(headers: Headers | Record<string, unknown> | undefined): string {
  const raw = headers instanceof Headers ? headers.get('x-forwarded-for') : headers?.['x-forwarded-for'];
  const first = typeof raw === 'string' ? raw.split(',')[0].trim() : '';
  return first.slice(0, 64) || 'local';
}
