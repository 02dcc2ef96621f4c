// In-memory inbox for the mail catcher: only what tests and the inbox page need.
import type { ParsedMail, AddressObject } from 'mailparser';

export type StoredAttachment = { filename: string | null; contentType: string; size: number; content: Buffer };

export type StoredMessage = {
  id: string;
  from: string;
  to: string;
  cc: string;
  subject: string;
  text: string | null;
  html: string | null;
  messageId: string | null;
  date: string;
  /** SMTP envelope (MAIL FROM / RCPT TO): the only place Bcc recipients show up. */
  envelope: { from: string | null; to: string[] };
  attachments: StoredAttachment[];
};

function addressText(value: AddressObject | AddressObject[] | undefined): string {
  if (!value) return '';
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(', ');
}

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  if (!value) return [];
  return (Array.isArray(value) ? value : [value])
    .flatMap((a) => a.value)
    .map((a) => a.address?.toLowerCase() ?? '')
    .filter(Boolean);
}

export class Inbox {
  private messages: StoredMessage[] = [];
  /** Parsed header recipients plus envelope ones, so `list(to)` needs no re-parsing. */
  private recipientsById = new Map<string, Set<string>>();
  private nextId = 1;

  add(mail: ParsedMail, envelope: StoredMessage['envelope']): StoredMessage {
    const message: StoredMessage = {
      id: String(this.nextId++),
      from: addressText(mail.from),
      to: addressText(mail.to),
      cc: addressText(mail.cc),
      subject: mail.subject ?? '',
      text: mail.text ?? null,
      // mailparser gives `false` when there is no HTML part.
      html: typeof mail.html === 'string' ? mail.html : null,
      messageId: mail.messageId ?? null,
      date: (mail.date ?? new Date()).toISOString(),
      envelope,
      attachments: mail.attachments.map((a) => ({
        filename: a.filename ?? null,
        contentType: a.contentType,
        size: a.content.length,
        content: a.content,
      })),
    };
    this.messages.push(message);
    const all = [...addresses(mail.to), ...addresses(mail.cc), ...envelope.to.map((a) => a.toLowerCase())];
    this.recipientsById.set(message.id, new Set(all));
    return message;
  }

  /** Newest first; `to` matches header To/Cc or any envelope recipient, case-insensitively. */
  list(to?: string): StoredMessage[] {
    const wanted = to?.trim().toLowerCase();
    const all = [...this.messages].reverse();
    if (!wanted) return all;
    return all.filter((m) => this.recipientsById.get(m.id)?.has(wanted));
  }

  get(id: string): StoredMessage | undefined {
    return this.messages.find((m) => m.id === id);
  }

  clear(): number {
    const count = this.messages.length;
    this.messages = [];
    this.recipientsById.clear();
    return count;
  }
}

/** JSON view for `GET /api/messages`: attachment bytes are fetched separately by index. */
export function messageJson(m: StoredMessage) {
  return {
    ...m,
    attachments: m.attachments.map(({ filename, contentType, size }, index) => ({
      index,
      filename,
      contentType,
      size,
      url: `/api/messages/${m.id}/attachments/${index}`,
    })),
  };
}
