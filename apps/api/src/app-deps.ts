import type { Database } from '@gloaming/db';
import type { Auth } from './auth/lucia';
import type { RateLimitStores } from './auth/rate-limit-store';
import type { AppConfig } from './config/env';
import type { MailTransport } from './mail/mailer';
import type { Outbox, OutboxPolicy } from './mail/outbox';
import type { FileStorage } from './storage/storage';

export interface Logger {
  info(msg: string): void;
  error(msg: string, err?: unknown): void;
}

/** Everything the app needs from outside. `createApp(deps)` never opens or listens itself. */
export interface AppDeps {
  orm: Database;
  config: AppConfig;
  /** The mail server connection. Modules never use it directly: createApp wraps it in the outbox. */
  mailer: MailTransport;
  /** Retry timings of the e-mail outbox (tests shorten them); defaults in outbox.ts. */
  outboxPolicy?: Partial<OutboxPolicy>;
  logger?: Logger;
  /** Uploaded files; defaults to DATA_DIR/files. */
  storage?: FileStorage;
}

/** What modules receive when they build their routers. */
export interface ModuleDeps extends Required<Omit<AppDeps, 'mailer' | 'outboxPolicy'>> {
  auth: Auth;
  /** Every e-mail goes through the outbox: `deps.mailer.send(mail, { em })`. */
  mailer: Outbox;
  /** The store for a named rate limiter (undefined = this process's memory): give one to every limiter. */
  rateLimits: RateLimitStores;
}
