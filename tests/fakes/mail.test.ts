// The mail catcher (fakes/mail/server.ts) with real nodemailer.
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { createTransport, type Transporter } from 'nodemailer';
import { startMailFake, type MailFake } from '@/fakes/mail/server';

type ApiMessage = {
  id: string;
  from: string;
  to: string;
  subject: string;
  text: string | null;
  html: string | null;
  attachments: { index: number; filename: string; contentType: string; size: number; url: string }[];
};

let mail: MailFake;
let transport: Transporter;

beforeAll(async () => {
  mail = await startMailFake({ smtpPort: 0, webPort: 0 });
  transport = createTransport({ host: '127.0.0.1', port: mail.smtpPort, secure: false, ignoreTLS: true });
});
afterAll(async () => {
  transport.close();
  await mail.close();
});
beforeEach(async () => {
  expect((await fetch(`${mail.webUrl}/api/messages`, { method: 'DELETE' })).status).toBe(204);
});

async function messagesTo(address: string): Promise<ApiMessage[]> {
  return (await (await fetch(`${mail.webUrl}/api/messages?to=${encodeURIComponent(address)}`)).json()) as ApiMessage[];
}

describe('mail catcher', () => {
  it('keeps a mail with its attachment and serves the same bytes back', async () => {
    const pdf = Buffer.from([0x25, 0x50, 0x44, 0x46, 0x2d, 0x00, 0xff, 0x10, 0x80]);
    await transport.sendMail({
      from: 'Combtrace <shop@combtrace.test>',
      to: 'buyer@example.test',
      subject: 'Your order 42',
      text: 'Thanks for your order.',
      html: '<p>Thanks for your order.</p>',
      attachments: [{ filename: 'invoice-42.pdf', content: pdf, contentType: 'application/pdf' }],
    });
    await transport.sendMail({
      from: 'shop@combtrace.test',
      to: 'someone-else@example.test',
      subject: 'Other',
      text: 'x',
    });

    const [message, ...rest] = await messagesTo('Buyer@Example.test');
    expect(rest).toHaveLength(0);
    expect(message).toMatchObject({
      subject: 'Your order 42',
      to: 'buyer@example.test',
      html: '<p>Thanks for your order.</p>',
    });
    expect(message.from).toContain('shop@combtrace.test');
    expect(message.text?.trim()).toBe('Thanks for your order.');
    expect(message.attachments[0]).toMatchObject({
      filename: 'invoice-42.pdf',
      contentType: 'application/pdf',
      size: pdf.length,
    });
    const res = await fetch(`${mail.webUrl}${message.attachments[0].url}`);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(Buffer.from(await res.arrayBuffer()).equals(pdf)).toBe(true);
  });

  it('lists newest first and finds Bcc recipients through the envelope', async () => {
    await transport.sendMail({
      from: 'shop@combtrace.test',
      to: 'a@example.test',
      bcc: 'audit@example.test',
      subject: 'first',
      text: '1',
    });
    await transport.sendMail({ from: 'shop@combtrace.test', to: 'a@example.test', subject: 'second', text: '2' });
    expect((await messagesTo('a@example.test')).map((m) => m.subject)).toEqual(['second', 'first']);
    expect((await messagesTo('audit@example.test')).map((m) => m.subject)).toEqual(['first']);
  });

  it('escapes mail content on the inbox page and sandboxes HTML on the message page', async () => {
    const evil = '<script>alert(1)</script>';
    await transport.sendMail({
      from: 'x@example.test',
      to: 'buyer@example.test',
      subject: `Hi ${evil}`,
      html: `<b>bold</b>${evil}`,
    });
    const inbox = await (await fetch(`${mail.webUrl}/`)).text();
    expect(inbox).not.toContain(evil);
    expect(inbox).toContain('Hi &lt;script&gt;alert(1)&lt;/script&gt;');

    const [message] = await messagesTo('buyer@example.test');
    const detail = await (await fetch(`${mail.webUrl}/m/${message.id}`)).text();
    expect(detail).not.toContain(evil);
    expect(detail).toMatch(/<iframe title="HTML body" sandbox srcdoc="&lt;b&gt;bold&lt;\/b&gt;&lt;script&gt;/);
  });

  it('accepts mail again after the catcher is restarted on the same ports', async () => {
    const { smtpPort, webPort } = mail;
    await mail.close();
    mail = await startMailFake({ smtpPort, webPort });
    await transport.sendMail({ from: 'x@example.test', to: 'again@example.test', subject: 'back', text: 'up' });
    expect((await messagesTo('again@example.test')).map((m) => m.subject)).toEqual(['back']);
  });
});
