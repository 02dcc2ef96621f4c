// `GET /`: what the fake holds, for a person debugging a checkout or a webhook by eye.
import { escapeHtml as e, page } from '../shared/http';
import { money } from './pay-page';
import type { StripeState } from './state';
import type { EventRecord } from './types';

function sessionRows(state: StripeState): string {
  return [...state.sessions.values()]
    .reverse()
    .map((s) => {
      const charge = s.payment_intent
        ? state.charges.get(state.paymentIntents.get(s.payment_intent)?.latest_charge ?? '')
        : undefined;
      const refunded = charge && charge.amount_refunded > 0 ? money(charge.amount_refunded, charge.currency) : '';
      const link = s.url ? `<a href="${e(s.url)}">pay page</a>` : '';
      return `<tr><td><code>${e(s.id)}</code></td><td>${e(s.status)} / ${e(s.payment_status)}</td>
<td>${e(money(s.amount_total, s.currency))}</td><td>${e(refunded)}</td><td>${e(s.customer_email ?? s.customer_details?.email ?? '')}</td>
<td><code>${e(JSON.stringify(s.metadata))}</code></td><td>${e(new Date(s.expires_at * 1000).toISOString())}</td><td>${link}</td></tr>`;
    })
    .join('\n');
}

function attempts(record: EventRecord): string {
  if (record.attempts.length === 0) return '—';
  return record.attempts
    .map((a) => `${a.copy > 1 ? `copy ${a.copy} ` : ''}#${a.attempt}: ${e(a.status ?? a.error ?? 'error')}`)
    .join('<br>');
}

function eventRows(state: StripeState): string {
  return [...state.events]
    .reverse()
    .map(
      (
        r,
      ) => `<tr><td><code>${e(r.event.id)}</code></td><td>${e(r.event.type)}</td><td><code>${e(r.event.data.object.id)}</code></td>
<td>${e(new Date(r.event.created * 1000).toISOString())}</td><td>${e(r.state)}</td><td>${attempts(r)}</td></tr>`,
    )
    .join('\n');
}

export function dashboardPage(state: StripeState, webhookUrl: string): string {
  const c = state.config;
  return page(
    'Combtrace Stripe fake',
    `<main><h1>Combtrace Stripe fake</h1>
<p>Webhooks go to <code>${e(webhookUrl)}</code>. Switches: deliverTwice=${c.deliverTwice}, reverseOrder=${c.reverseOrder},
failNext=${c.failNext}, latencyMs=${c.latencyMs}. Reload to refresh.</p>
<h2>Checkout Sessions</h2>
<table><thead><tr><th scope="col">Id</th><th scope="col">Status</th><th scope="col">Total</th><th scope="col">Refunded</th>
<th scope="col">Email</th><th scope="col">Metadata</th><th scope="col">Expires</th><th scope="col">Link</th></tr></thead>
<tbody>${sessionRows(state)}</tbody></table>
<h2>Events</h2>
<table><thead><tr><th scope="col">Id</th><th scope="col">Type</th><th scope="col">Object</th><th scope="col">Created</th>
<th scope="col">Delivery</th><th scope="col">Attempts (HTTP status)</th></tr></thead>
<tbody>${eventRows(state)}</tbody></table></main>`,
  );
}
