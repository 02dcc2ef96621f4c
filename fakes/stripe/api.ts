// HTTP plumbing for `/v1`: auth header, form bodies, `failNext`, idempotency.
import type { IncomingMessage, ServerResponse } from 'node:http';
import { readBody, sendJson } from '../shared/http';
import { ApiError, newId } from './errors';
import { IdempotencyStore, internalError, type ApiResult } from './idempotency';
import { parseForm } from './params';
import { routes } from './routes';
import type { StripeState } from './state';

export type ApiContext = { state: StripeState; idempotency: IdempotencyStore; publicUrl: string };

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

function header(req: IncomingMessage, name: string): string | undefined {
  const value = req.headers[name];
  return Array.isArray(value) ? value[0] : value;
}

export async function handleApi(ctx: ApiContext, req: IncomingMessage, res: ServerResponse, url: URL): Promise<void> {
  const requestId = newId('req_', 14);
  const headers: Record<string, string> = { 'request-id': requestId };
  const reply = (result: ApiResult) => sendJson(res, result.status, result.body, headers);
  try {
    const apiKey = /^Bearer (\S+)$/.exec(header(req, 'authorization') ?? '')?.[1];
    if (!apiKey) throw new ApiError(401, 'authentication_error', 'You did not provide an API key.');
    const method = req.method ?? 'GET';
    const body = await readBody(req);
    // The SDK sends GET parameters in the query string and POST parameters as a form body (as SDK 23.1.0 was seen to do).
    const params = parseForm(method === 'POST' ? body : url.search.slice(1));
    ctx.state.sweepExpired();
    const { config } = ctx.state;
    if (config.failNext > 0) {
      // A simulated outage before the endpoint runs: nothing is saved for the key, so a retry can succeed.
      config.failNext -= 1;
      return reply({ status: 500, body: new ApiError(500, 'api_error', 'Simulated Stripe outage (failNext).').body() });
    }
    let ids: string[] = [];
    const route = routes.find((r) => {
      const match = r.method === method ? r.path.exec(url.pathname) : null;
      if (match) ids = match.slice(1).map(decodeURIComponent);
      return match !== null;
    });
    if (!route) {
      throw new ApiError(
        404,
        'invalid_request_error',
        `Unrecognized request URL (${method}: ${url.pathname}).`,
        'resource_missing',
      );
    }
    const key = method === 'POST' ? header(req, 'idempotency-key') : undefined;
    if (key) headers['idempotency-key'] = key;
    const result = await ctx.idempotency.run(apiKey, key, url.pathname, params, async () => {
      if (config.latencyMs > 0) await sleep(config.latencyMs);
      const request = { id: requestId, idempotency_key: key ?? null };
      return { status: 200, body: route.run(ctx.state, params, ids, request, ctx.publicUrl) };
    });
    if (result.replayed) headers['idempotent-replayed'] = 'true';
    reply(result);
  } catch (err) {
    reply(err instanceof ApiError ? { status: err.status, body: err.body() } : internalError(err));
  }
}
