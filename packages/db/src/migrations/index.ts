import type { MigrationObject } from '@mikro-orm/core';
import { Migration20261201232154_outbox_sender_name } from './Migration20261201232154_outbox_sender_name';
import { Migration20261201225615_rate_limit_counters } from './Migration20261201225615_rate_limit_counters';
import { Migration20261201225121_outbox_messages } from './Migration20261201225121_outbox_messages';
import { Migration20261201221527_installer_as_wired_and_commissioning } from './Migration20261201221527_installer_as_wired_and_commissioning';
import { Migration20261201221318_firm_settings_and_activity } from './Migration20261201221318_firm_settings_and_activity';
import { Migration20261201221050_portal_approval_payments } from './Migration20261201221050_portal_approval_payments';
import { Migration20261201202956_circuits } from './Migration20261201202956_circuits';
import { Migration20261201194445_catalogue_and_quotes } from './Migration20261201194445_catalogue_and_quotes';
import { Migration20261201193224_initial } from './Migration20261201193224_initial';

/**
 * Every migration, in order. `npm run migration:create -w @gloaming/db -- <name>` writes a
 * new file beside this one and appends it here; `npm run db:check` fails in CI until
 * entities and migrations agree.
 */
export const migrationsList: MigrationObject[] = [
  { name: 'Migration20261201193224_initial', class: Migration20261201193224_initial },
  { name: 'Migration20261201194445_catalogue_and_quotes', class: Migration20261201194445_catalogue_and_quotes },
  { name: 'Migration20261201202956_circuits', class: Migration20261201202956_circuits },
  { name: 'Migration20261201221050_portal_approval_payments', class: Migration20261201221050_portal_approval_payments },
  { name: 'Migration20261201221318_firm_settings_and_activity', class: Migration20261201221318_firm_settings_and_activity },
  { name: 'Migration20261201221527_installer_as_wired_and_commissioning', class: Migration20261201221527_installer_as_wired_and_commissioning },
  { name: 'Migration20261201225121_outbox_messages', class: Migration20261201225121_outbox_messages },
  { name: 'Migration20261201225615_rate_limit_counters', class: Migration20261201225615_rate_limit_counters },
  { name: 'Migration20261201232154_outbox_sender_name', class: Migration20261201232154_outbox_sender_name },
  // next migration
];
