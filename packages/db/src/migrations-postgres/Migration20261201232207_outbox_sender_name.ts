import { Migration } from '@mikro-orm/migrations';

export class Migration20261201232207_outbox_sender_name extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "outbox_messages" add column "from_name" varchar(255) null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "outbox_messages" drop column "from_name";`);
  }

}
