// The hosted payment page behind a session's `url`: a plain, accessible card form.
import type { IncomingMessage, ServerResponse } from 'node:http';
import { escapeHtml, page, readBody, redirect, sendHtml } from '../shared/http';
import { ApiError } from './errors';
import { parseForm } from './params';
import { paySession, successUrl } from './payments';
import type { StripeState } from './state';
import type { CheckoutSession } from './types';

type Fields = { card: string; expiry: string; cvc: string; name: string; email: string };
const empty: Fields = { card: '', expiry: '', cvc: '', name: '', email: '' };

/** Minor units → "£24.00"; Intl knows which currencies have no decimals (docs.stripe.com/currencies). */
export function money(amount: number, currency: string): string {
  const format = new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() });
  return format.format(amount / 10 ** (format.resolvedOptions().maximumFractionDigits ?? 2));
}

function field(id: keyof Fields, label: string, value: string, attrs: string, invalid: boolean, hint = ''): string {
  // An invalid field points at the error message too, so screen readers announce why.
  const ids = [invalid ? 'form-error' : '', hint ? `${id}-hint` : ''].filter(Boolean).join(' ');
  const described = ids ? ` aria-describedby="${ids}"` : '';
  return `<label for="${id}">${label}</label>
<input id="${id}" name="${id}" value="${escapeHtml(value)}" required${described}${invalid ? ' aria-invalid="true"' : ''} ${attrs}>
${hint ? `<p id="${id}-hint">${hint}</p>` : ''}`;
}

function form(
  state: StripeState,
  s: CheckoutSession,
  values: Fields,
  error?: { message: string; field?: keyof Fields },
): string {
  const items = (state.lineItems.get(s.id) ?? [])
    .map(
      (i) =>
        `<tr><td>${escapeHtml(i.description)}</td><td>${i.quantity}</td><td>${escapeHtml(money(i.amount_total, i.currency))}</td></tr>`,
    )
    .join('');
  const total = escapeHtml(money(s.amount_total, s.currency));
  const bad = (f: keyof Fields) => error?.field === f;
  const alert = error ? `<p role="alert" class="error" id="form-error">${escapeHtml(error.message)}</p>` : '';
  const email = s.customer_email
    ? ''
    : field('email', 'Email', values.email, 'type="email" autocomplete="email"', bad('email'));
  const cancel = s.cancel_url ? `<p><a href="${escapeHtml(s.cancel_url)}">Cancel and go back</a></p>` : '';
  return page(
    `Pay ${total}`,
    `<main><h1>Pay ${total}</h1><p>Test mode: no card is charged.</p>
<table><caption>Order</caption><thead><tr><th scope="col">Item</th><th scope="col">Qty</th><th scope="col">Amount</th></tr></thead>
<tbody>${items}</tbody></table>
<form method="post" action="/pay/${encodeURIComponent(s.id)}" novalidate>${alert}${email}
${field('card', 'Card number', values.card, 'inputmode="numeric" autocomplete="cc-number"', bad('card'), 'Test cards: 4242 4242 4242 4242 succeeds, 4000 0000 0000 0002 is declined.')}
${field('expiry', 'Expiry (MM / YY)', values.expiry, 'inputmode="numeric" autocomplete="cc-exp" placeholder="MM / YY"', bad('expiry'))}
${field('cvc', 'Security code (CVC)', values.cvc, 'inputmode="numeric" autocomplete="cc-csc"', bad('cvc'))}
${field('name', 'Name on card', values.name, 'autocomplete="cc-name"', bad('name'))}
<button type="submit">Pay ${total}</button></form>${cancel}</main>`,
  );
}

function closedPage(s: CheckoutSession): string {
  const done = successUrl(s);
  const message = s.status === 'complete' ? 'This checkout is already paid.' : 'This checkout session has expired.';
  const link = s.status === 'complete' && done ? `<p><a href="${escapeHtml(done)}">Continue</a></p>` : '';
  return page('Checkout', `<main><h1>Checkout</h1><p role="status">${message}</p>${link}</main>`);
}

function checkFields(v: Fields, needsEmail: boolean): { message: string; field: keyof Fields } | undefined {
  const expiry = /^(\d{2})\s*\/\s*(\d{2})$/.exec(v.expiry);
  const now = new Date();
  const expired =
    expiry && (Number(expiry[2]) + 2000) * 12 + Number(expiry[1]) < now.getFullYear() * 12 + now.getMonth() + 1;
  if (needsEmail && !/^[^@\s]+@[^@\s]+$/.test(v.email)) return { field: 'email', message: 'Enter your email address.' };
  if (!v.card.trim()) return { field: 'card', message: 'Enter a card number.' };
  if (!expiry || Number(expiry[1]) < 1 || Number(expiry[1]) > 12 || expired)
    return { field: 'expiry', message: 'Enter a future expiry date as MM / YY.' };
  if (!/^\d{3,4}$/.test(v.cvc)) return { field: 'cvc', message: 'Enter the 3 or 4 digit security code.' };
  if (!v.name.trim()) return { field: 'name', message: 'Enter the name on the card.' };
  return undefined;
}

export async function handlePayPage(
  state: StripeState,
  id: string,
  req: IncomingMessage,
  res: ServerResponse,
): Promise<void> {
  state.sweepExpired();
  const session = state.sessions.get(id);
  if (!session) return sendHtml(res, 404, page('Not found', '<main><h1>No such checkout session</h1></main>'));
  if (session.status !== 'open') return sendHtml(res, 200, closedPage(session));
  if (req.method !== 'POST') return sendHtml(res, 200, form(state, session, empty));
  const raw = parseForm(await readBody(req));
  const text = (k: keyof Fields) => {
    const v = raw[k];
    return typeof v === 'string' ? v : '';
  };
  const values: Fields = {
    card: text('card'),
    expiry: text('expiry'),
    cvc: text('cvc'),
    name: text('name'),
    email: text('email'),
  };
  const problem = checkFields(values, !session.customer_email);
  if (problem) return sendHtml(res, 400, form(state, session, values, problem));
  try {
    paySession(state, session, values);
  } catch (err) {
    if (!(err instanceof ApiError)) throw err;
    // A declined card leaves the session open and unpaid, so the buyer can try again.
    return sendHtml(res, err.status, form(state, session, values, { message: err.message, field: 'card' }));
  }
  const target = successUrl(session);
  if (target) return redirect(res, 303, target);
  sendHtml(res, 200, closedPage(session));
}
