// Local mail catcher (smtp-server and mailparser; nodemailer.com/extras/smtp-server): SMTP in, inbox page and JSON API out, loopback only.
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { closeServer, listen, LOOPBACK, sendHtml, sendJson, page } from '../shared/http';
import { Inbox, messageJson } from './store';
import { inboxPage, messagePage } from './pages';

export type MailFakeOptions = { smtpPort: number; webPort: number };
export type MailFake = { smtpPort: number; webPort: number; webUrl: string; close(): Promise<void> };

function createSmtp(inbox: Inbox): SMTPServer {
  return new SMTPServer({
    // smtp-server's bundled certificate expired in Feb 2025 ("ESOCKET certificate has expired"), so no STARTTLS.
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    // Accept any credentials on plain text so an app configured with SMTP auth works offline too.
    allowInsecureAuth: true,
    onAuth: (auth, _session, cb) => cb(null, { user: auth.username ?? 'local' }),
    size: 10_000_000,
    // Default is 30 s; a pooled client connection should not hold up `close()` in tests that restart the catcher.
    closeTimeout: 1000,
    logger: false,
    onData(stream, session, cb) {
      const envelope = {
        from: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
        to: session.envelope.rcptTo.map((r) => r.address),
      };
      simpleParser(stream).then(
        (mail) => {
          inbox.add(mail, envelope);
          cb();
        },
        (err: Error) => cb(err),
      );
    },
  });
}

function handleWeb(inbox: Inbox, req: IncomingMessage, res: ServerResponse): void {
  const url = new URL(req.url ?? '/', `http://${LOOPBACK}`);
  const parts = url.pathname.split('/').filter(Boolean).map(decodeURIComponent);
  const method = req.method ?? 'GET';
  if (method === 'GET' && parts.length === 0) return sendHtml(res, 200, inboxPage(inbox.list()));
  if (method === 'GET' && parts[0] === 'm' && parts.length === 2) {
    const message = inbox.get(parts[1]);
    return message
      ? sendHtml(res, 200, messagePage(message))
      : sendHtml(res, 404, page('Not found', '<p>No such message.</p>'));
  }
  if (parts[0] === 'api' && parts[1] === 'messages') {
    if (parts.length === 2 && method === 'GET') {
      return sendJson(res, 200, inbox.list(url.searchParams.get('to') ?? undefined).map(messageJson));
    }
    if (parts.length === 2 && method === 'DELETE') {
      res.writeHead(204).end();
      inbox.clear();
      return;
    }
    const message = parts[2] ? inbox.get(parts[2]) : undefined;
    if (method === 'GET' && message && parts.length === 3) return sendJson(res, 200, messageJson(message));
    const attachment = message && parts[3] === 'attachments' ? message.attachments[Number(parts[4])] : undefined;
    if (method === 'GET' && attachment && parts.length === 5) {
      res.writeHead(200, {
        'content-type': attachment.contentType,
        'content-length': String(attachment.size),
        // Always a download, so a crafted HTML attachment is never rendered on this origin.
        'content-disposition': `attachment; filename="${(attachment.filename ?? 'attachment').replace(/[^\w.-]/g, '_')}"`,
        'x-content-type-options': 'nosniff',
      });
      res.end(attachment.content);
      return;
    }
  }
  sendJson(res, 404, { error: 'Not found' });
}

export async function startMailFake({ smtpPort, webPort }: MailFakeOptions): Promise<MailFake> {
  const inbox = new Inbox();
  const smtp = createSmtp(inbox);
  const web = createServer((req, res) => {
    try {
      handleWeb(inbox, req, res);
    } catch (err) {
      // e.g. a malformed %-escape in the path: answer instead of crashing the catcher.
      if (!res.headersSent) sendJson(res, 400, { error: err instanceof Error ? err.message : String(err) });
    }
  });
  const boundSmtp = await listen(smtp.server, smtpPort);
  const boundWeb = await listen(web, webPort).catch(async (err: unknown) => {
    await new Promise<void>((resolve) => smtp.close(() => resolve()));
    throw err;
  });
  return {
    smtpPort: boundSmtp,
    webPort: boundWeb,
    webUrl: `http://${LOOPBACK}:${boundWeb}`,
    async close() {
      await Promise.all([new Promise<void>((resolve) => smtp.close(() => resolve())), closeServer(web)]);
    },
  };
}
