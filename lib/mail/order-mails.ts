import { formatMoney } from '@/lib/domain/units';
import type { OrderDetail } from '@/lib/data/orders/read';
import type { MailInput } from './outbox';
import { escapeHtml, mailHtml } from './templates';

/** Order e-mails: plain text and HTML, every value from people or the database escaped. */
type Ctx = { business: string; link: string; address?: string };

const money = (o: OrderDetail, cents: number) => formatMoney(cents, o.currency.toUpperCase());
const lotsText = (l: OrderDetail['lines'][number]) =>
  l.lots
    .filter((a) => a.state === 'sold')
    .map((a) => `${a.code} × ${a.quantity}`)
    .join(', ');

function linesText(o: OrderDetail): string {
  return o.lines
    .map(
      (l) =>
        `${l.quantity} × ${l.productName} — ${money(o, l.quantity * l.unitPriceCents)}${lotsText(l) ? `\n    lot ${lotsText(l)}` : ''}`,
    )
    .join('\n');
}

function linesHtml(o: OrderDetail): string {
  const rows = o.lines
    .map(
      (l) =>
        `<tr><td style="padding:4px 8px 4px 0">${l.quantity} × ${escapeHtml(l.productName)}${lotsText(l) ? `<br><span style="font-size:12px;color:#5b6b60">Lot ${escapeHtml(lotsText(l))}</span>` : ''}</td><td style="text-align:right">${escapeHtml(money(o, l.quantity * l.unitPriceCents))}</td></tr>`,
    )
    .join('');
  const ship =
    o.shippingCents > 0
      ? `<tr><td>Shipping</td><td style="text-align:right">${escapeHtml(money(o, o.shippingCents))}</td></tr>`
      : '';
  return `<table style="border-collapse:collapse;width:100%">${rows}${ship}<tr><td style="padding-top:8px"><strong>Total</strong></td><td style="text-align:right;padding-top:8px"><strong>${escapeHtml(money(o, o.totalCents))}</strong></td></tr></table>`;
}

const button = (link: string, label: string) =>
  `<p><a href="${escapeHtml(link)}" style="background:#234a35;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(label)}</a></p>`;

export function orderConfirmationMail(o: OrderDetail, c: Ctx): MailInput {
  const how =
    o.fulfilment === 'pickup'
      ? `You chose pickup at the honey house${c.address ? ` (${c.address})` : ''}. We will e-mail you when it is ready.`
      : 'We will e-mail you when it is on its way.';
  const text = `Hello ${o.name},\n\nThank you for your order ${o.number}. Your payment of ${money(o, o.totalCents)} was received.\n\n${linesText(o)}\n${o.shippingCents > 0 ? `Shipping — ${money(o, o.shippingCents)}\n` : ''}Total — ${money(o, o.totalCents)}\n\n${how}\nThe lot code on each jar lets you see where its honey came from.\n\nHoney is not for infants under 12 months.\n\nYour order: ${c.link}\n`;
  const html = mailHtml(
    c.business,
    `<p>Hello ${escapeHtml(o.name)},</p><p>Thank you for your order <strong>${escapeHtml(o.number)}</strong>. Your payment was received.</p>${linesHtml(o)}<p>${escapeHtml(how)}</p><p style="font-size:13px">Honey is not for infants under 12 months.</p>${button(c.link, 'See your order')}`,
  );
  return { to: o.email, subject: `Order ${o.number} confirmed`, text, html, dedupeKey: `order-confirmed-${o.id}` };
}

export function orderReadyMail(o: OrderDetail, c: Ctx): MailInput {
  const lead = `Your order ${o.number} is packed and ready for pickup at the honey house${c.address ? `, ${c.address}` : ''}.`;
  return {
    to: o.email,
    subject: `Order ${o.number} is ready for pickup`,
    text: `Hello ${o.name},\n\n${lead}\n\n${linesText(o)}\n\nYour order: ${c.link}\n`,
    html: mailHtml(
      c.business,
      `<p>Hello ${escapeHtml(o.name)},</p><p>${escapeHtml(lead)}</p>${linesHtml(o)}${button(c.link, 'See your order')}`,
    ),
    dedupeKey: `order-ready-${o.id}`,
  };
}

export function orderShippedMail(o: OrderDetail, c: Ctx): MailInput {
  const tracking = o.tracking ? `Tracking: ${o.tracking}` : '';
  return {
    to: o.email,
    subject: `Order ${o.number} is on its way`,
    text: `Hello ${o.name},\n\nYour order ${o.number} has been shipped.\n${tracking}\n\n${linesText(o)}\n\nYour order: ${c.link}\n`,
    html: mailHtml(
      c.business,
      `<p>Hello ${escapeHtml(o.name)},</p><p>Your order <strong>${escapeHtml(o.number)}</strong> has been shipped.</p>${tracking ? `<p>${escapeHtml(tracking)}</p>` : ''}${linesHtml(o)}${button(c.link, 'See your order')}`,
    ),
    dedupeKey: `order-shipped-${o.id}`,
  };
}

export function orderRefundMail(o: OrderDetail, c: Ctx & { amountCents: number; refundId: number }): MailInput {
  const lead = `We have refunded ${money(o, c.amountCents)} for order ${o.number} to your card. It can take a few days to show on your statement.`;
  return {
    to: o.email,
    subject: `Refund for order ${o.number}`,
    text: `Hello ${o.name},\n\n${lead}\n\nRefunded so far: ${money(o, o.refundedCents)} of ${money(o, o.totalCents)}.\n\nYour order: ${c.link}\n`,
    html: mailHtml(
      c.business,
      `<p>Hello ${escapeHtml(o.name)},</p><p>${escapeHtml(lead)}</p><p>Refunded so far: ${escapeHtml(money(o, o.refundedCents))} of ${escapeHtml(money(o, o.totalCents))}.</p>${button(c.link, 'See your order')}`,
    ),
    dedupeKey: `order-refund-${c.refundId}`,
  };
}

export function paidAfterReleaseMail(o: OrderDetail, c: Ctx & { to: string }): MailInput {
  const lead = `Order ${o.number} (${o.email}) was paid after its reservation had ended, and there were not enough jars left to fill it. Please refund it on the Orders page of the back office (Admin › Orders), from the order's Refund form.`;
  return {
    to: c.to,
    subject: `Refund needed: order ${o.number}`,
    text: `${lead}\n\n${c.link}\n`,
    html: mailHtml(c.business, `<p>${escapeHtml(lead)}</p>${button(c.link, 'Open the order')}`),
    dedupeKey: `order-needs-refund-${o.id}`,
  };
}
