import { Migration } from '@mikro-orm/migrations';

export class Migration20261201221318_firm_settings_and_activity extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`firm_events\` (\`id\` text not null, \`organization_id\` text not null, \`type\` text not null, \`actor_id\` text null, \`subject_id\` text null, \`data\` json not null, \`at\` datetime not null, constraint \`firm_events_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`firm_events_actor_id_foreign\` foreign key(\`actor_id\`) references \`users\`(\`id\`) on delete set null on update cascade, constraint \`firm_events_subject_id_foreign\` foreign key(\`subject_id\`) references \`users\`(\`id\`) on delete set null on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`firm_events_organization_id_index\` on \`firm_events\` (\`organization_id\`);`);
    this.addSql(`create index \`firm_events_actor_id_index\` on \`firm_events\` (\`actor_id\`);`);
    this.addSql(`create index \`firm_events_subject_id_index\` on \`firm_events\` (\`subject_id\`);`);
    this.addSql(`create index \`firm_events_at_index\` on \`firm_events\` (\`at\`);`);

    this.addSql(`alter table \`organizations\` add column \`logo_content_type\` text null;`);
    this.addSql(`alter table \`organizations\` add column \`vat_rates_bp\` json null;`);
    this.addSql(`alter table \`organizations\` add column \`design_settings\` json null;`);
    this.addSql(`alter table \`organizations\` add column \`email_sender_name\` text not null default '';`);
  }

}
