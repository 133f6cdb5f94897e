import { afterEach, describe, expect, it } from 'vitest';
import nodemailer from 'nodemailer';
import { startMailCatcher, type MailCatcher } from '../src';

let catcher: MailCatcher | undefined;
afterEach(async () => {
  await catcher?.close();
  catcher = undefined;
});

describe('mail catcher', () => {
  it('keeps a message sent over real SMTP and shows it in the web inbox, escaped', async () => {
    catcher = await startMailCatcher();
    const transport = nodemailer.createTransport({ host: catcher.host, port: catcher.smtpPort, secure: false, ignoreTLS: true });
    await transport.sendMail({
      from: 'Nightjar <quotes@nightjar.example>',
      to: 'homeowner@example.com',
      subject: 'Your quote <script>',
      text: 'Open it at http://127.0.0.1:3000/portal/q/abc',
      attachments: [{ filename: 'quote.pdf', content: Buffer.from('%PDF-1.4') }],
    });
    const m = await catcher.waitFor((x) => x.to.includes('homeowner@example.com'));
    expect(m.subject).toBe('Your quote <script>');
    expect(m.from).toBe('quotes@nightjar.example');
    expect(m.attachments).toEqual([{ filename: 'quote.pdf', contentType: 'application/pdf', size: 8 }]);

    const list = (await (await fetch(`http://${catcher.host}:${catcher.webPort}/messages`)).json()) as { messages: unknown[] };
    expect(list.messages).toHaveLength(1);
    const html = await (await fetch(`http://${catcher.host}:${catcher.webPort}/`)).text();
    expect(html).toContain('Your quote &lt;script&gt;');
    expect(html).not.toContain('<script>');
  });

  it('waitFor rejects when nothing matching arrives in time', async () => {
    catcher = await startMailCatcher();
    await expect(catcher.waitFor(() => true, 50)).rejects.toThrow(/No matching e-mail/);
  });
});
