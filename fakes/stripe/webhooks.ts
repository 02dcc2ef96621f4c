// Webhook delivery: signed like Stripe (`t=…,v1=…`, docs.stripe.com/webhooks/signature),
// retried on non-2xx or connection errors after 1, 2, 4, 8, 16 × `retryBaseMs`, optionally sent twice
// or, per Checkout Session, held briefly and sent newest first.
import Stripe from 'stripe';
import type { EventRecord, FakeConfig } from './types';

export type WebhookOptions = {
  url: string;
  secret: string;
  /** 1000 gives Stripe-like 1 s, 2 s, 4 s, 8 s, 16 s; tests pass a few ms. */
  retryBaseMs: number;
  /** How long `reverseOrder` collects one session's events before sending them newest first. */
  holdMs: number;
  timeoutMs: number;
};

const RETRIES = 5;

export class WebhookSender {
  // Only used to sign: `generateTestHeaderString` is the SDK's own documented signer (README "Testing Webhook signing").
  private readonly signer = new Stripe('sk_test_fake');
  private readonly timers = new Set<NodeJS.Timeout>();
  private held = new Map<string, EventRecord[]>();
  private abort = new AbortController();

  constructor(
    private readonly options: WebhookOptions,
    private readonly config: () => FakeConfig,
  ) {}

  enqueue(record: EventRecord): void {
    if (this.config().reverseOrder && record.sessionId) return this.hold(record, record.sessionId);
    void this.send(record);
  }

  /** Drops held events and pending retries (used by `/_fake/reset` and `close`). */
  stop(): void {
    for (const timer of this.timers) clearTimeout(timer);
    this.timers.clear();
    this.held = new Map();
    this.abort.abort();
    this.abort = new AbortController();
  }

  private hold(record: EventRecord, sessionId: string): void {
    record.state = 'held';
    const group = this.held.get(sessionId);
    if (group) return void group.push(record);
    this.held.set(sessionId, [record]);
    this.later(this.options.holdMs, () => void this.flush(sessionId));
  }

  /** Newest first, each one's first attempt finished before the next starts, so the order is observable. */
  private async flush(sessionId: string): Promise<void> {
    const group = this.held.get(sessionId) ?? [];
    this.held.delete(sessionId);
    for (const record of group.reverse()) await this.send(record);
  }

  /** Resolves after the first attempt of each copy; retries run on timers. */
  private async send(record: EventRecord): Promise<void> {
    record.state = 'pending';
    const copies = this.config().deliverTwice ? 2 : 1;
    for (let copy = 1; copy <= copies; copy++) await this.attempt(record, copy, 1);
  }

  private async attempt(record: EventRecord, copy: number, attempt: number): Promise<void> {
    const signal = this.abort.signal;
    const ok = await this.post(record, copy, attempt, signal);
    if (signal.aborted) return;
    if (ok) {
      record.state = 'delivered';
      return;
    }
    if (attempt > RETRIES) {
      if (record.state !== 'delivered') record.state = 'failed';
      return;
    }
    this.later(this.options.retryBaseMs * 2 ** (attempt - 1), () => void this.attempt(record, copy, attempt + 1));
  }

  private async post(record: EventRecord, copy: number, attempt: number, signal: AbortSignal): Promise<boolean> {
    // Stripe sends pretty-printed JSON and signs each attempt with a fresh timestamp (300 s tolerance).
    const payload = JSON.stringify(record.event, null, 2);
    const signature = this.signer.webhooks.generateTestHeaderString({ payload, secret: this.options.secret });
    const at = new Date().toISOString();
    try {
      const res = await fetch(this.options.url, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': signature,
          'user-agent': 'Stripe/1.0 (+https://stripe.com/docs/webhooks)',
        },
        body: payload,
        signal: AbortSignal.any([signal, AbortSignal.timeout(this.options.timeoutMs)]),
      });
      await res.arrayBuffer().catch(() => undefined);
      record.attempts.push({ copy, attempt, at, status: res.status });
      return res.status >= 200 && res.status < 300;
    } catch (err) {
      const error = err instanceof Error ? (err.cause instanceof Error ? err.cause.message : err.message) : String(err);
      record.attempts.push({ copy, attempt, at, status: null, error });
      return false;
    }
  }

  private later(ms: number, run: () => void): void {
    const timer = setTimeout(() => {
      this.timers.delete(timer);
      run();
    }, ms);
    this.timers.add(timer);
  }
}
