import { Migration } from '@mikro-orm/migrations';

export class Migration20261201225121_outbox_messages extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`outbox_messages\` (\`id\` text not null, \`organization_id\` text null, \`kind\` text not null, \`reference\` text null, \`to\` text not null, \`subject\` text not null, \`text\` text not null, \`html\` text null, \`attachments\` json not null, \`status\` text not null default 'pending', \`attempts\` integer not null default 0, \`next_attempt_at\` datetime not null, \`last_error\` text null, \`sent_at\` datetime null, \`created_at\` datetime not null, constraint \`outbox_messages_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on delete set null on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`outbox_messages_organization_id_index\` on \`outbox_messages\` (\`organization_id\`);`);
    this.addSql(`create index \`outbox_messages_reference_index\` on \`outbox_messages\` (\`reference\`);`);
    this.addSql(`create index \`outbox_messages_status_index\` on \`outbox_messages\` (\`status\`);`);
    this.addSql(`create index \`outbox_messages_next_attempt_at_index\` on \`outbox_messages\` (\`next_attempt_at\`);`);
  }

}
