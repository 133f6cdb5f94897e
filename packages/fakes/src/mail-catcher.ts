import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

/**
 * A local SMTP catcher: a real SMTP server on loopback that keeps every message it is
 * given, plus a small web inbox to read them (HTML page at `/`, JSON at `/messages`).
 * Development, tests and the demo send mail here; production sends to a real relay.
 */
export interface CaughtMessage {
  id: number;
  receivedAt: string;
  from: string;
  /** The display name in the From header ('' when it has none). */
  fromName: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  attachments: { filename: string; contentType: string; size: number }[];
}

export interface MailCatcher {
  smtpPort: number;
  webPort: number;
  host: string;
  messages(): CaughtMessage[];
  /** Resolves with the first message (already caught or arriving) matching `predicate`. */
  waitFor(predicate: (m: CaughtMessage) => boolean, timeoutMs?: number): Promise<CaughtMessage>;
  clear(): void;
  close(): Promise<void>;
}

export interface MailCatcherOptions {
  host?: string;
  /** 0 picks a free port. */
  smtpPort?: number;
  webPort?: number;
  /** Oldest messages are dropped past this many. */
  keep?: number;
}

const escapeHtml = (s: string): string =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function addresses(value: unknown): string[] {
  const list = Array.isArray(value) ? value : value ? [value] : [];
  return list.flatMap((a: { value?: { address?: string }[] }) => (a.value ?? []).map((v) => v.address ?? '')).filter(Boolean);
}

export async function startMailCatcher(options: MailCatcherOptions = {}): Promise<MailCatcher> {
  const host = options.host ?? '127.0.0.1';
  const keep = options.keep ?? 500;
  const store: CaughtMessage[] = [];
  let nextId = 1;
  const waiters = new Set<{ predicate: (m: CaughtMessage) => boolean; resolve: (m: CaughtMessage) => void }>();

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const message: CaughtMessage = {
            id: nextId++,
            receivedAt: new Date().toISOString(),
            from: addresses(parsed.from)[0] ?? session.envelope.mailFrom?.toString() ?? '',
            fromName: parsed.from?.value[0]?.name ?? '',
            to: addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
            attachments: parsed.attachments.map((a) => ({
              filename: a.filename ?? 'attachment',
              contentType: a.contentType,
              size: a.size,
            })),
          };
          store.push(message);
          if (store.length > keep) store.shift();
          for (const w of waiters) {
            if (w.predicate(message)) {
              waiters.delete(w);
              w.resolve(message);
            }
          }
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });

  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(options.smtpPort ?? 0, host, () => resolve());
  });
  const smtpPort = (smtp.server.address() as AddressInfo).port;

  const web: Server = createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://localhost');
    if (url.pathname === '/messages') {
      res.writeHead(200, { 'content-type': 'application/json' });
      res.end(JSON.stringify({ messages: [...store].reverse() }));
      return;
    }
    const match = /^\/messages\/(\d+)$/.exec(url.pathname);
    if (match) {
      const m = store.find((x) => x.id === Number(match[1]));
      if (!m) {
        res.writeHead(404, { 'content-type': 'text/plain' }).end('No such message');
        return;
      }
      // The message body is shown as text, never rendered, so hostile HTML stays inert.
      res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
      res.end(page(`${escapeHtml(m.subject)}`, `<p><a href="/">&larr; Inbox</a></p><dl><dt>From</dt><dd>${escapeHtml(m.from)}</dd><dt>To</dt><dd>${escapeHtml(m.to.join(', '))}</dd><dt>Received</dt><dd>${escapeHtml(m.receivedAt)}</dd></dl><pre>${linkify(escapeHtml(m.text))}</pre>${m.attachments.map((a) => `<p>Attachment: ${escapeHtml(a.filename)} (${escapeHtml(a.contentType)}, ${a.size} bytes)</p>`).join('')}`));
      return;
    }
    if (url.pathname === '/') {
      const rows = [...store]
        .reverse()
        .map(
          (m) =>
            `<tr><td>${escapeHtml(m.receivedAt.replace('T', ' ').slice(0, 19))}</td><td>${escapeHtml(m.to.join(', '))}</td><td><a href="/messages/${m.id}">${escapeHtml(m.subject || '(no subject)')}</a></td></tr>`,
        )
        .join('');
      res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
      res.end(
        page(
          'Local inbox',
          `<p>Every e-mail Gloaming sends in development lands here; nothing leaves this machine.</p><table><thead><tr><th>Received (UTC)</th><th>To</th><th>Subject</th></tr></thead><tbody>${rows || '<tr><td colspan="3">No messages yet.</td></tr>'}</tbody></table>`,
        ),
      );
      return;
    }
    res.writeHead(404, { 'content-type': 'text/plain' }).end('Not found');
  });
  await new Promise<void>((resolve, reject) => {
    web.once('error', reject);
    web.listen(options.webPort ?? 0, host, () => resolve());
  });
  const webPort = (web.address() as AddressInfo).port;

  return {
    smtpPort,
    webPort,
    host,
    messages: () => [...store],
    waitFor(predicate, timeoutMs = 5000) {
      const found = store.find(predicate);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const waiter = { predicate, resolve: (m: CaughtMessage) => (clearTimeout(timer), resolve(m)) };
        const timer = setTimeout(() => {
          waiters.delete(waiter);
          reject(new Error(`No matching e-mail arrived within ${timeoutMs} ms`));
        }, timeoutMs);
        waiters.add(waiter);
      });
    },
    clear: () => {
      store.length = 0;
    },
    close: async () => {
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
      web.closeAllConnections();
      await new Promise<void>((resolve) => web.close(() => resolve()));
    },
  };
}

function linkify(escaped: string): string {
  return escaped.replace(/https?:\/\/[^\s<]+/g, (u) => `<a href="${u}">${u}</a>`);
}

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${title} · Gloaming local inbox</title><style>body{font:15px/1.5 system-ui,sans-serif;margin:2rem auto;max-width:60rem;padding:0 1rem;color:#1b1d33}table{border-collapse:collapse;width:100%}th,td{text-align:left;padding:.4rem .6rem;border-bottom:1px solid #d7d9e6}pre{white-space:pre-wrap;background:#f4f4f8;padding:1rem}a{color:#3b3f9c}dt{font-weight:600}</style></head><body><h1>${title}</h1>${body}</body></html>`;
}
