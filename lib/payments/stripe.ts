import 'server-only';
import Stripe from 'stripe';

/**
 * The one Stripe client. With STRIPE_API_HOST set (lib/ops/up.sh, the e2e set-up) it talks to the
 * local fake in fakes/stripe; without it, to the real service — only configuration changes
 * (the SDK's documented host, port and protocol options). Telemetry is off. The client is rebuilt when the settings change (tests start
 * the fake on a free port per file).
 */
const holder = globalThis as unknown as { __combtraceStripe?: { key: string; client: Stripe } };

export function stripe(): Stripe {
  const secret = process.env.STRIPE_SECRET_KEY;
  if (!secret) throw new Error('STRIPE_SECRET_KEY is not set.');
  const host = process.env.STRIPE_API_HOST || undefined;
  const port = process.env.STRIPE_API_PORT ? Number(process.env.STRIPE_API_PORT) : undefined;
  const protocol = (process.env.STRIPE_API_PROTOCOL || undefined) as 'http' | 'https' | undefined;
  const key = [secret, host, port, protocol].join('|');
  if (holder.__combtraceStripe?.key === key) return holder.__combtraceStripe.client;
  const client = new Stripe(secret, {
    telemetry: false,
    maxNetworkRetries: 2,
    ...(host ? { host, port, protocol: protocol ?? 'https' } : {}),
  });
  holder.__combtraceStripe = { key, client };
  return client;
}

export function webhookSecret(): string {
  const secret = process.env.STRIPE_WEBHOOK_SECRET;
  if (!secret) throw new Error('STRIPE_WEBHOOK_SECRET is not set.');
  return secret;
}
