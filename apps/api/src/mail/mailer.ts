import nodemailer from 'nodemailer';
import type { AppConfig } from '../config/env';

export interface OutgoingMail {
  to: string;
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

/** Sends e-mail. The api's only way out to a mail server. */
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

export function createSmtpMailer(mail: AppConfig['mail']): Mailer {
  const transport = nodemailer.createTransport({
    host: mail.host,
    port: mail.port,
    secure: mail.secure,
    ignoreTLS: !mail.secure && (mail.host === '127.0.0.1' || mail.host === 'localhost'),
    ...(mail.user ? { auth: { user: mail.user, pass: mail.pass ?? '' } } : {}),
  });
  return {
    async send(m) {
      await transport.sendMail({ from: mail.from, to: m.to, subject: m.subject, text: m.text, ...(m.html ? { html: m.html } : {}), ...(m.attachments ? { attachments: m.attachments } : {}) });
    },
    close: () => transport.close(),
  };
}
