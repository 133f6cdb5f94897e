import type { MigrationObject } from '@mikro-orm/core';
import { Migration20261201232207_outbox_sender_name } from './Migration20261201232207_outbox_sender_name';
import { Migration20261201231328_initial } from './Migration20261201231328_initial';

/**
 * Every PostgreSQL migration, in order. `npm run migration:create -- <name>` writes the SQLite
 * migration and the PostgreSQL one from the same entities, each beside its list;
 * `npm run db:check` fails in CI until both agree with the entities.
 */
export const migrationsList: MigrationObject[] = [
  { name: 'Migration20261201231328_initial', class: Migration20261201231328_initial },
  { name: 'Migration20261201232207_outbox_sender_name', class: Migration20261201232207_outbox_sender_name },
  // next migration
];
