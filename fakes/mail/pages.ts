// Inbox pages for the mail catcher. Mail content is untrusted (mailparser does not sanitise HTML,
// nodemailer.com/extras/mailparser), so every value is escaped and mail HTML is shown only inside `<iframe sandbox srcdoc>`.
import { escapeHtml, page } from '../shared/http';
import type { StoredMessage } from './store';

export function inboxPage(messages: StoredMessage[]): string {
  const rows = messages
    .map(
      (m) => `<tr><td>${escapeHtml(m.date)}</td><td>${escapeHtml(m.from)}</td><td>${escapeHtml(m.to)}</td>
<td><a href="/m/${encodeURIComponent(m.id)}">${escapeHtml(m.subject || '(no subject)')}</a></td>
<td>${m.attachments.length}</td></tr>`,
    )
    .join('\n');
  const table = messages.length
    ? `<table><caption>${messages.length} message(s), newest first</caption>
<thead><tr><th scope="col">Date</th><th scope="col">From</th><th scope="col">To</th><th scope="col">Subject</th><th scope="col">Attachments</th></tr></thead>
<tbody>${rows}</tbody></table>`
    : '<p>No mail yet. Send to SMTP on this host; it is kept in memory only.</p>';
  return page('Combtrace mail catcher', `<main><h1>Combtrace mail catcher</h1>${table}</main>`);
}

export function messagePage(m: StoredMessage): string {
  const attachments = m.attachments
    .map(
      (
        a,
        i,
      ) => `<li><a href="/api/messages/${encodeURIComponent(m.id)}/attachments/${i}">${escapeHtml(a.filename ?? `attachment-${i}`)}</a>
(${escapeHtml(a.contentType)}, ${a.size} bytes)</li>`,
    )
    .join('');
  // No `allow-*` tokens: scripts, forms, popups and same-origin access all stay blocked.
  const html =
    m.html === null ? '' : `<h2>HTML</h2><iframe title="HTML body" sandbox srcdoc="${escapeHtml(m.html)}"></iframe>`;
  const text = m.text === null ? '' : `<h2>Text</h2><pre>${escapeHtml(m.text)}</pre>`;
  const body = `<main><p><a href="/">Inbox</a></p><h1>${escapeHtml(m.subject || '(no subject)')}</h1>
<dl><dt>From</dt><dd>${escapeHtml(m.from)}</dd><dt>To</dt><dd>${escapeHtml(m.to)}</dd>
${m.cc ? `<dt>Cc</dt><dd>${escapeHtml(m.cc)}</dd>` : ''}
<dt>Envelope</dt><dd>${escapeHtml(m.envelope.from ?? '')} → ${escapeHtml(m.envelope.to.join(', '))}</dd>
<dt>Date</dt><dd>${escapeHtml(m.date)}</dd><dt>Message-ID</dt><dd>${escapeHtml(m.messageId ?? '')}</dd></dl>
${attachments ? `<h2>Attachments</h2><ul>${attachments}</ul>` : ''}${html}${text}</main>`;
  return page(m.subject || 'Message', body);
}
