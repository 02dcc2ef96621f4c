// `/v1` endpoints the SDK calls plus a few read-only ones that help when debugging.
import { invalid, noSuch } from './errors';
import { expandList, int, str, type Params } from './params';
import { createRefund } from './refunds';
import { createSession, sessionView } from './sessions';
import type { StripeState } from './state';
import type { RequestRef } from './types';

type Route = {
  method: 'GET' | 'POST';
  path: RegExp;
  run(state: StripeState, params: Params, ids: string[], request: RequestRef, publicUrl: string): unknown;
};

/** Lists as the SDK's auto-pagination expects: `data`, `has_more`, `starting_after=<last id>` (SDK src/autoPagination.ts). */
function page<T extends { id: string }>(items: T[], params: Params, url: string) {
  const limit = Math.min(int(params.limit, 'limit', 1) ?? 10, 100);
  const after = str(params.starting_after, 'starting_after');
  const before = str(params.ending_before, 'ending_before');
  let start = 0;
  let end = items.length;
  if (after) start = items.findIndex((i) => i.id === after) + 1;
  if (before)
    end = Math.max(
      items.findIndex((i) => i.id === before),
      0,
    );
  const window = before && !after ? items.slice(Math.max(end - limit, 0), end) : items.slice(start, start + limit);
  const hasMore = before && !after ? end - limit > 0 : start + limit < items.length;
  return { object: 'list', data: window, has_more: hasMore, url };
}

const newestFirst = <T extends { created: number }>(items: Iterable<T>): T[] => [...items].reverse();

function session(state: StripeState, id: string) {
  const found = state.sessions.get(id);
  if (!found) throw noSuch('checkout.session', id);
  return found;
}

export const routes: Route[] = [
  {
    method: 'POST',
    path: /^\/v1\/checkout\/sessions$/,
    run: (s, p, _i, _r, publicUrl) => sessionView(s, createSession(s, p, publicUrl), p),
  },
  {
    method: 'GET',
    path: /^\/v1\/checkout\/sessions$/,
    run: (s, p) => {
      const pi = str(p.payment_intent, 'payment_intent');
      const status = str(p.status, 'status');
      const all = newestFirst(s.sessions.values()).filter(
        (x) => (!pi || x.payment_intent === pi) && (!status || x.status === status),
      );
      return page(all, p, '/v1/checkout/sessions');
    },
  },
  {
    method: 'GET',
    path: /^\/v1\/checkout\/sessions\/([^/]+)$/,
    run: (s, p, [id]) => sessionView(s, session(s, id), p),
  },
  {
    method: 'POST',
    path: /^\/v1\/checkout\/sessions\/([^/]+)\/expire$/,
    run: (s, p, [id], request) => {
      const found = session(s, id);
      if (found.status !== 'open')
        throw invalid(
          'Only Checkout Sessions with a status of `open` can be expired.',
          undefined,
          'checkout_session_not_open',
        );
      s.expire(found, request);
      return sessionView(s, found, p);
    },
  },
  {
    method: 'GET',
    path: /^\/v1\/checkout\/sessions\/([^/]+)\/line_items$/,
    run: (s, p, [id]) => page(s.lineItems.get(session(s, id).id) ?? [], p, `/v1/checkout/sessions/${id}/line_items`),
  },
  {
    method: 'GET',
    path: /^\/v1\/payment_intents\/([^/]+)$/,
    run: (s, p, [id]) => {
      const pi = s.paymentIntents.get(id);
      if (!pi) throw noSuch('payment_intent', id);
      const expand = expandList(p);
      if (expand.some((f) => f !== 'latest_charge')) throw invalid('This property cannot be expanded.', 'expand');
      return expand.length ? { ...pi, latest_charge: s.charges.get(pi.latest_charge) ?? null } : pi;
    },
  },
  {
    method: 'GET',
    path: /^\/v1\/charges\/([^/]+)$/,
    run: (s, _p, [id]) => s.charges.get(id) ?? throwMissing('charge', id),
  },
  { method: 'POST', path: /^\/v1\/refunds$/, run: (s, p, _i, request) => createRefund(s, p, request) },
  {
    method: 'GET',
    path: /^\/v1\/refunds$/,
    run: (s, p) => {
      const pi = str(p.payment_intent, 'payment_intent');
      const charge = str(p.charge, 'charge');
      const all = newestFirst(s.refunds.values()).filter(
        (r) => (!pi || r.payment_intent === pi) && (!charge || r.charge === charge),
      );
      return page(all, p, '/v1/refunds');
    },
  },
  {
    method: 'GET',
    path: /^\/v1\/refunds\/([^/]+)$/,
    run: (s, _p, [id]) => s.refunds.get(id) ?? throwMissing('refund', id),
  },
  {
    method: 'GET',
    path: /^\/v1\/events$/,
    run: (s, p) => {
      const type = str(p.type, 'type');
      const all = newestFirst(s.events.map((r) => r.event)).filter((e) => !type || e.type === type);
      return page(all, p, '/v1/events');
    },
  },
  {
    method: 'GET',
    path: /^\/v1\/events\/([^/]+)$/,
    run: (s, _p, [id]) => s.events.find((r) => r.event.id === id)?.event ?? throwMissing('event', id),
  },
];

function throwMissing(kind: string, id: string): never {
  throw noSuch(kind, id);
}
