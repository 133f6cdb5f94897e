import { Migration } from '@mikro-orm/migrations';

export class Migration20261201202956_circuits extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`circuits\` (\`id\` text not null, \`organization_id\` text not null, \`revision_id\` text not null, \`area\` text not null, \`name\` text not null default '', \`kind\` text not null, \`position\` integer not null, \`design\` json not null, \`result\` json not null, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`version\` integer not null default 1, constraint \`circuits_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`circuits_revision_id_foreign\` foreign key(\`revision_id\`) references \`quote_revisions\`(\`id\`) on delete cascade on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`circuits_organization_id_index\` on \`circuits\` (\`organization_id\`);`);
    this.addSql(`create index \`circuits_revision_id_index\` on \`circuits\` (\`revision_id\`);`);
  }

}
