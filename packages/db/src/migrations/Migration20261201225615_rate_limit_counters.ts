import { Migration } from '@mikro-orm/migrations';

export class Migration20261201225615_rate_limit_counters extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`rate_limit_counters\` (\`key\` text not null, \`hits\` integer not null, \`reset_at\` datetime not null, primary key (\`key\`));`);
    this.addSql(`create index \`rate_limit_counters_reset_at_index\` on \`rate_limit_counters\` (\`reset_at\`);`);
  }

}
