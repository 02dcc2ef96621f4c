// Local Stripe fake for the real `stripe` SDK: `/v1` API, hosted pay page,
// signed webhooks, `/_fake` test hooks and a dashboard at `/`. Loopback only, in memory only.
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import { closeServer, listen, LOOPBACK, page, sendHtml, sendJson } from '../shared/http';
import { handleApi } from './api';
import { IdempotencyStore, internalError } from './idempotency';
import { dashboardPage } from './dashboard';
import { handlePayPage } from './pay-page';
import { StripeState } from './state';
import { handleHooks } from './test-hooks';
import { WebhookSender } from './webhooks';

export type StripeFakeOptions = {
  port: number;
  webhookUrl: string;
  webhookSecret: string;
  /** Base of session `url`s; defaults to http://127.0.0.1:<port>. */
  publicUrl?: string;
  /** Retry delays are 1, 2, 4, 8, 16 × this (default 1000 ms). */
  retryBaseMs?: number;
  /** How long `reverseOrder` holds one session's events (default 500 ms). */
  reverseHoldMs?: number;
  /** Per-attempt webhook timeout (default 10 000 ms). */
  webhookTimeoutMs?: number;
};

export type StripeFake = { port: number; url: string; close(): Promise<void> };

/** Open sessions past `expires_at` are expired on every request and by this sweep. */
const SWEEP_MS = 1000;

export async function startStripeFake(options: StripeFakeOptions): Promise<StripeFake> {
  // The callback runs only once an event is emitted, after `sender` exists.
  const state = new StripeState((record) => sender.enqueue(record));
  const sender = new WebhookSender(
    {
      url: options.webhookUrl,
      secret: options.webhookSecret,
      retryBaseMs: options.retryBaseMs ?? 1000,
      holdMs: options.reverseHoldMs ?? 500,
      timeoutMs: options.webhookTimeoutMs ?? 10_000,
    },
    () => state.config,
  );
  const idempotency = new IdempotencyStore();
  const ctx = { state, idempotency, publicUrl: options.publicUrl ?? '' };
  const reset = () => {
    sender.stop();
    state.reset();
    idempotency.clear();
  };

  const route = async (req: IncomingMessage, res: ServerResponse): Promise<void> => {
    const url = new URL(req.url ?? '/', `http://${LOOPBACK}`);
    const path = url.pathname;
    if (path.startsWith('/v1/')) return handleApi(ctx, req, res, url);
    if (path.startsWith('/_fake/')) return handleHooks({ state, reset }, req, res, url);
    const pay = /^\/pay\/([^/]+)$/.exec(path);
    if (pay) return handlePayPage(state, decodeURIComponent(pay[1]), req, res);
    if (path === '/' && req.method === 'GET') return sendHtml(res, 200, dashboardPage(state, options.webhookUrl));
    sendHtml(res, 404, page('Not found', '<main><h1>Not found</h1></main>'));
  };
  const server = createServer((req, res) => {
    route(req, res).catch((err: unknown) => {
      if (!res.headersSent) sendJson(res, 500, internalError(err).body);
    });
  });

  const port = await listen(server, options.port);
  ctx.publicUrl = (options.publicUrl ?? `http://${LOOPBACK}:${port}`).replace(/\/$/, '');
  const sweep = setInterval(() => state.sweepExpired(), SWEEP_MS);
  sweep.unref();
  return {
    port,
    url: `http://${LOOPBACK}:${port}`,
    async close() {
      clearInterval(sweep);
      sender.stop();
      await closeServer(server);
    },
  };
}
