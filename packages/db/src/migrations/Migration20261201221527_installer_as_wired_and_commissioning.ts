import { Migration } from '@mikro-orm/migrations';

export class Migration20261201221527_installer_as_wired_and_commissioning extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`commissioning_records\` (\`id\` text not null, \`organization_id\` text not null, \`quote_id\` text not null, \`circuit_id\` text not null, \`readings\` json not null, \`checks\` json not null, \`note\` text not null default '', \`flagged\` integer not null default 0, \`recorded_by_id\` text null, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`version\` integer not null default 1, constraint \`commissioning_records_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`commissioning_records_quote_id_foreign\` foreign key(\`quote_id\`) references \`quotes\`(\`id\`) on delete cascade on update cascade, constraint \`commissioning_records_circuit_id_foreign\` foreign key(\`circuit_id\`) references \`circuits\`(\`id\`) on delete cascade on update cascade, constraint \`commissioning_records_recorded_by_id_foreign\` foreign key(\`recorded_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`commissioning_records_organization_id_index\` on \`commissioning_records\` (\`organization_id\`);`);
    this.addSql(`create index \`commissioning_records_quote_id_index\` on \`commissioning_records\` (\`quote_id\`);`);
    this.addSql(`create index \`commissioning_records_circuit_id_index\` on \`commissioning_records\` (\`circuit_id\`);`);
    this.addSql(`create unique index \`commissioning_records_circuit_id_unique\` on \`commissioning_records\` (\`circuit_id\`);`);
    this.addSql(`create index \`commissioning_records_recorded_by_id_index\` on \`commissioning_records\` (\`recorded_by_id\`);`);

    this.addSql(`create table \`circuit_as_wired\` (\`id\` text not null, \`organization_id\` text not null, \`circuit_id\` text not null, \`blocks\` json not null, \`safe\` integer not null, \`recorded_by_id\` text null, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`version\` integer not null default 1, constraint \`circuit_as_wired_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`circuit_as_wired_circuit_id_foreign\` foreign key(\`circuit_id\`) references \`circuits\`(\`id\`) on delete cascade on update cascade, constraint \`circuit_as_wired_recorded_by_id_foreign\` foreign key(\`recorded_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`circuit_as_wired_organization_id_index\` on \`circuit_as_wired\` (\`organization_id\`);`);
    this.addSql(`create index \`circuit_as_wired_circuit_id_index\` on \`circuit_as_wired\` (\`circuit_id\`);`);
    this.addSql(`create unique index \`circuit_as_wired_circuit_id_unique\` on \`circuit_as_wired\` (\`circuit_id\`);`);
    this.addSql(`create index \`circuit_as_wired_recorded_by_id_index\` on \`circuit_as_wired\` (\`recorded_by_id\`);`);
  }

}
