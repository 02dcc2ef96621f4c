/**
 * Refuses a cross-site request: a browser always sends Origin on a POST, so a foreign one is
 * a forged request (ASVS 3.5). Requests without Origin (server-to-server, tests) pass.
 */
export class OriginError extends Error {
  status = 403 as const;
  constructor() {
    super('This request came from another site and was refused.');
  }
}

export function isSameOrigin(h: Headers): boolean {
  const origin = h.get('origin');
  if (!origin) return true;
  const host = h.get('x-forwarded-host') ?? h.get('host');
  try {
    return new URL(origin).host === host;
  } catch {
    return false;
  }
}

export async function assertSameOrigin(h: Headers): Promise<void> {
  if (!isSameOrigin(h)) throw new OriginError();
}
