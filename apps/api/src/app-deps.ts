import type { Database } from '@gloaming/db';
import type { Auth } from './auth/lucia';
import type { AppConfig } from './config/env';
import type { Mailer } from './mail/mailer';
import type { FileStorage } from './storage/storage';

export interface Logger {
  info(msg: string): void;
  error(msg: string, err?: unknown): void;
}

/** Everything the app needs from outside. `createApp(deps)` never opens or listens itself. */
export interface AppDeps {
  orm: Database;
  config: AppConfig;
  mailer: Mailer;
  logger?: Logger;
  /** Uploaded files; defaults to DATA_DIR/files. */
  storage?: FileStorage;
}

/** What modules receive when they build their routers. */
export interface ModuleDeps extends Required<AppDeps> {
  auth: Auth;
}
