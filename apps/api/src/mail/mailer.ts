import nodemailer from 'nodemailer';
import type { AppConfig } from '../config/env';

export interface OutgoingMail {
  to: string;
  /** The sender's display name (a firm's e-mail sender name); the address stays the configured one. */
  fromName?: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: MailAttachment[];
}

export interface MailAttachment {
  filename: string;
  content: Buffer;
  contentType: string;
}

/**
 * Hands one e-mail to the mail server. Only the outbox (outbox.ts) uses it: modules queue
 * their mail there, so a mail server that is down delays mail but loses none.
 */
export interface MailTransport {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

export function createSmtpMailer(mail: AppConfig['mail']): MailTransport {
  const transport = nodemailer.createTransport({
    host: mail.host,
    port: mail.port,
    secure: mail.secure,
    // a hand-over that hangs must end well inside the outbox's lease, so it can be retried
    connectionTimeout: 15_000,
    greetingTimeout: 15_000,
    socketTimeout: 60_000,
    ignoreTLS: !mail.secure && (mail.host === '127.0.0.1' || mail.host === 'localhost'),
    ...(mail.user ? { auth: { user: mail.user, pass: mail.pass ?? '' } } : {}),
  });
  return {
    async send(m) {
      await transport.sendMail({ from: m.fromName ? { name: m.fromName, address: fromAddress(mail.from) } : mail.from, to: m.to, subject: m.subject, text: m.text, ...(m.html ? { html: m.html } : {}), ...(m.attachments ? { attachments: m.attachments } : {}) });
    },
    close: () => transport.close(),
  };
}

/** The bare address of a configured From ("Gloaming <quotes@example.test>" -> "quotes@example.test"). */
export function fromAddress(from: string): string {
  const angled = /<([^<>\s]+)>\s*$/.exec(from);
  return (angled ? angled[1]! : from).trim();
}
