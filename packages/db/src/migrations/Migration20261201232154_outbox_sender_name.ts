import { Migration } from '@mikro-orm/migrations';

export class Migration20261201232154_outbox_sender_name extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`outbox_messages\` add column \`from_name\` text null;`);
  }

}
