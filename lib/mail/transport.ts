import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';

const holder = globalThis as unknown as { __combtraceMail?: Transporter };

/** SMTP from env; defaults to the local mail catcher in fakes/mail (plain SMTP on loopback, no TLS). */
export function mailTransport(): Transporter {
  holder.__combtraceMail ??= nodemailer.createTransport({
    host: process.env.SMTP_HOST ?? '127.0.0.1',
    port: Number(process.env.SMTP_PORT ?? 1025),
    secure: process.env.SMTP_SECURE === 'true',
    ignoreTLS: process.env.SMTP_HOST === undefined,
    auth: process.env.SMTP_USER ? { user: process.env.SMTP_USER, pass: process.env.SMTP_PASS ?? '' } : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  });
  return holder.__combtraceMail;
}

export function mailFrom(): string {
  return process.env.MAIL_FROM ?? 'Combtrace <no-reply@combtrace.local>';
}
