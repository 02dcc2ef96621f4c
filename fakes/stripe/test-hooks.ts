// `/_fake/*`: switches and shortcuts for tests, so no browser is needed.
import type { IncomingMessage, ServerResponse } from 'node:http';
import { readBody, sendJson } from '../shared/http';
import { ApiError, invalid, noSuch } from './errors';
import { paySession, successUrl, type Payer } from './payments';
import type { StripeState } from './state';
import type { FakeConfig } from './types';

export type HookContext = { state: StripeState; reset(): void };

async function readJson(req: IncomingMessage): Promise<Record<string, unknown>> {
  const text = await readBody(req);
  if (!text.trim()) return {};
  const value: unknown = JSON.parse(text);
  if (!value || typeof value !== 'object' || Array.isArray(value)) throw invalid('Expected a JSON object.');
  return value as Record<string, unknown>;
}

const optionalString = (v: unknown, name: string): string | undefined => {
  if (v === undefined || typeof v === 'string') return v;
  throw invalid(`${name} must be a string.`, name);
};

function applyConfig(config: FakeConfig, input: Record<string, unknown>): FakeConfig {
  for (const flag of ['deliverTwice', 'reverseOrder'] as const) {
    const v = input[flag];
    if (v === undefined) continue;
    if (typeof v !== 'boolean') throw invalid(`${flag} must be a boolean.`, flag);
    config[flag] = v;
  }
  for (const count of ['failNext', 'latencyMs'] as const) {
    const v = input[count];
    if (v === undefined) continue;
    if (typeof v !== 'number' || !Number.isInteger(v) || v < 0)
      throw invalid(`${count} must be a non-negative integer.`, count);
    config[count] = v;
  }
  return config;
}

export async function handleHooks(
  ctx: HookContext,
  req: IncomingMessage,
  res: ServerResponse,
  url: URL,
): Promise<void> {
  const { state } = ctx;
  const method = req.method ?? 'GET';
  try {
    const [, , area, id, action] = url.pathname.split('/').map(decodeURIComponent);
    if (area === 'sessions' && method === 'POST' && (action === 'pay' || action === 'expire')) {
      state.sweepExpired();
      const session = state.sessions.get(id);
      if (!session) throw noSuch('checkout.session', id);
      if (action === 'expire') {
        if (session.status !== 'open') throw invalid('Only Checkout Sessions with a status of `open` can be expired.');
        state.expire(session, { id: null, idempotency_key: null });
        return sendJson(res, 200, { session });
      }
      const body = await readJson(req);
      const payer: Payer = {
        card: optionalString(body.card, 'card'),
        name: optionalString(body.name, 'name'),
        email: optionalString(body.email, 'email'),
      };
      paySession(state, session, payer);
      return sendJson(res, 200, { session, redirectUrl: successUrl(session) });
    }
    if (area === 'config' && method === 'POST')
      return sendJson(res, 200, applyConfig(state.config, await readJson(req)));
    if (area === 'config' && method === 'GET') return sendJson(res, 200, state.config);
    if (area === 'events' && method === 'GET') {
      const type = url.searchParams.get('type');
      const session = url.searchParams.get('session');
      const data = state.events.filter(
        (r) => (!type || r.event.type === type) && (!session || r.sessionId === session),
      );
      return sendJson(res, 200, { data });
    }
    if (area === 'reset' && method === 'POST') {
      ctx.reset();
      return sendJson(res, 200, { ok: true });
    }
    throw new ApiError(404, 'invalid_request_error', `No test hook ${method} ${url.pathname}.`);
  } catch (err) {
    if (err instanceof ApiError) return sendJson(res, err.status, err.body());
    sendJson(res, 400, invalid(err instanceof Error ? err.message : String(err)).body());
  }
}
