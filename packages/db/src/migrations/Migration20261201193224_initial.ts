import { Migration } from '@mikro-orm/migrations';

export class Migration20261201193224_initial extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`organizations\` (\`id\` text not null, \`name\` text not null, \`address_lines\` text not null default '', \`vat_number\` text null, \`currency\` text not null default 'GBP', \`locale\` text not null default 'en-GB', \`vat_rate_bp\` integer not null default 2000, \`deposit_percent_bp\` integer not null default 3000, \`markup_percent_bp\` integer not null default 3500, \`labour_rate_minor_per_hour\` integer not null default 4500, \`terms_text\` text not null default '', \`logo_path\` text null, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`version\` integer not null default 1, primary key (\`id\`));`);

    this.addSql(`create table \`users\` (\`id\` text not null, \`organization_id\` text not null, \`email\` text not null, \`name\` text not null, \`password_hash\` text null, \`role\` text not null, \`active\` integer not null default true, \`created_at\` datetime not null, \`last_sign_in_at\` datetime null, \`version\` integer not null default 1, constraint \`users_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`users_organization_id_index\` on \`users\` (\`organization_id\`);`);
    this.addSql(`create unique index \`users_email_unique\` on \`users\` (\`email\`);`);

    this.addSql(`create table \`sessions\` (\`id\` text not null, \`user_id\` text not null, \`organization_id\` text not null, \`expires_at\` datetime not null, \`created_at\` datetime not null, constraint \`sessions_user_id_foreign\` foreign key(\`user_id\`) references \`users\`(\`id\`) on delete cascade on update cascade, constraint \`sessions_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`sessions_user_id_index\` on \`sessions\` (\`user_id\`);`);
    this.addSql(`create index \`sessions_organization_id_index\` on \`sessions\` (\`organization_id\`);`);

    this.addSql(`create table \`auth_tokens\` (\`id\` text not null, \`organization_id\` text not null, \`user_id\` text not null, \`purpose\` text not null, \`token_hash\` text not null, \`expires_at\` datetime not null, \`used_at\` datetime null, \`created_at\` datetime not null, constraint \`auth_tokens_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`auth_tokens_user_id_foreign\` foreign key(\`user_id\`) references \`users\`(\`id\`) on delete cascade on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`auth_tokens_organization_id_index\` on \`auth_tokens\` (\`organization_id\`);`);
    this.addSql(`create index \`auth_tokens_user_id_index\` on \`auth_tokens\` (\`user_id\`);`);
    this.addSql(`create unique index \`auth_tokens_token_hash_unique\` on \`auth_tokens\` (\`token_hash\`);`);
  }

}
