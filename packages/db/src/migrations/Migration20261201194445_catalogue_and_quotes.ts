import { Migration } from '@mikro-orm/migrations';

export class Migration20261201194445_catalogue_and_quotes extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`import_mappings\` (\`id\` text not null, \`organization_id\` text not null, \`supplier\` text not null, \`columns\` json not null, \`updated_at\` datetime not null, constraint \`import_mappings_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`import_mappings_organization_id_index\` on \`import_mappings\` (\`organization_id\`);`);
    this.addSql(`create unique index \`import_mappings_organization_id_supplier_unique\` on \`import_mappings\` (\`organization_id\`, \`supplier\`);`);

    this.addSql(`create table \`customers\` (\`id\` text not null, \`organization_id\` text not null, \`name\` text not null, \`email\` text null, \`phone\` text null, \`notes\` text not null default '', \`created_at\` datetime not null, \`updated_at\` datetime not null, \`version\` integer not null default 1, constraint \`customers_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`customers_organization_id_index\` on \`customers\` (\`organization_id\`);`);

    this.addSql(`create table \`products\` (\`id\` text not null, \`organization_id\` text not null, \`kind\` text not null, \`supplier\` text not null, \`supplier_code\` text not null, \`name\` text not null, \`description\` text not null default '', \`unit\` text not null default 'each', \`cost_minor\` integer not null default 0, \`list_price_minor\` integer not null default 0, \`active\` integer not null, \`spec\` json not null, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`version\` integer not null default 1, constraint \`products_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`products_organization_id_index\` on \`products\` (\`organization_id\`);`);
    this.addSql(`create index \`products_kind_index\` on \`products\` (\`kind\`);`);
    this.addSql(`create unique index \`products_organization_id_supplier_supplier_code_unique\` on \`products\` (\`organization_id\`, \`supplier\`, \`supplier_code\`);`);

    this.addSql(`create table \`sites\` (\`id\` text not null, \`organization_id\` text not null, \`customer_id\` text not null, \`label\` text not null default '', \`address_lines\` text not null, \`postcode\` text not null default '', \`access_notes\` text not null default '', \`created_at\` datetime not null, \`version\` integer not null default 1, constraint \`sites_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`sites_customer_id_foreign\` foreign key(\`customer_id\`) references \`customers\`(\`id\`) on delete cascade on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`sites_organization_id_index\` on \`sites\` (\`organization_id\`);`);
    this.addSql(`create index \`sites_customer_id_index\` on \`sites\` (\`customer_id\`);`);

    this.addSql(`create table \`quotes\` (\`id\` text not null, \`organization_id\` text not null, \`number\` integer not null, \`title\` text not null default '', \`customer_id\` text not null, \`site_id\` text null, \`estimator_id\` text not null, \`status\` text not null, \`value_minor\` integer not null default 0, \`valid_until\` datetime null, \`sent_at\` datetime null, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`version\` integer not null default 1, constraint \`quotes_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`quotes_customer_id_foreign\` foreign key(\`customer_id\`) references \`customers\`(\`id\`) on update cascade, constraint \`quotes_site_id_foreign\` foreign key(\`site_id\`) references \`sites\`(\`id\`) on delete set null on update cascade, constraint \`quotes_estimator_id_foreign\` foreign key(\`estimator_id\`) references \`users\`(\`id\`) on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`quotes_organization_id_index\` on \`quotes\` (\`organization_id\`);`);
    this.addSql(`create index \`quotes_customer_id_index\` on \`quotes\` (\`customer_id\`);`);
    this.addSql(`create index \`quotes_site_id_index\` on \`quotes\` (\`site_id\`);`);
    this.addSql(`create index \`quotes_estimator_id_index\` on \`quotes\` (\`estimator_id\`);`);
    this.addSql(`create index \`quotes_status_index\` on \`quotes\` (\`status\`);`);
    this.addSql(`create unique index \`quotes_organization_id_number_unique\` on \`quotes\` (\`organization_id\`, \`number\`);`);

    this.addSql(`create table \`quote_revisions\` (\`id\` text not null, \`organization_id\` text not null, \`quote_id\` text not null, \`number\` integer not null, \`state\` text not null, \`content\` json not null, \`settings\` json not null, \`totals\` json null, \`content_hash\` text null, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`sent_at\` datetime null, \`version\` integer not null default 1, constraint \`quote_revisions_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`quote_revisions_quote_id_foreign\` foreign key(\`quote_id\`) references \`quotes\`(\`id\`) on delete cascade on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`quote_revisions_organization_id_index\` on \`quote_revisions\` (\`organization_id\`);`);
    this.addSql(`create index \`quote_revisions_quote_id_index\` on \`quote_revisions\` (\`quote_id\`);`);
    this.addSql(`create unique index \`quote_revisions_quote_id_number_unique\` on \`quote_revisions\` (\`quote_id\`, \`number\`);`);

    this.addSql(`create table \`portal_tokens\` (\`id\` text not null, \`organization_id\` text not null, \`revision_id\` text not null, \`token_hash\` text not null, \`sent_to\` text not null, \`expires_at\` datetime not null, \`revoked_at\` datetime null, \`created_at\` datetime not null, constraint \`portal_tokens_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`portal_tokens_revision_id_foreign\` foreign key(\`revision_id\`) references \`quote_revisions\`(\`id\`) on delete cascade on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`portal_tokens_organization_id_index\` on \`portal_tokens\` (\`organization_id\`);`);
    this.addSql(`create index \`portal_tokens_revision_id_index\` on \`portal_tokens\` (\`revision_id\`);`);
    this.addSql(`create unique index \`portal_tokens_token_hash_unique\` on \`portal_tokens\` (\`token_hash\`);`);

    this.addSql(`create table \`quote_events\` (\`id\` text not null, \`organization_id\` text not null, \`quote_id\` text not null, \`revision_id\` text null, \`type\` text not null, \`actor_id\` text null, \`data\` json not null, \`at\` datetime not null, constraint \`quote_events_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`quote_events_quote_id_foreign\` foreign key(\`quote_id\`) references \`quotes\`(\`id\`) on delete cascade on update cascade, constraint \`quote_events_revision_id_foreign\` foreign key(\`revision_id\`) references \`quote_revisions\`(\`id\`) on delete set null on update cascade, constraint \`quote_events_actor_id_foreign\` foreign key(\`actor_id\`) references \`users\`(\`id\`) on delete set null on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`quote_events_organization_id_index\` on \`quote_events\` (\`organization_id\`);`);
    this.addSql(`create index \`quote_events_quote_id_index\` on \`quote_events\` (\`quote_id\`);`);
    this.addSql(`create index \`quote_events_revision_id_index\` on \`quote_events\` (\`revision_id\`);`);
    this.addSql(`create index \`quote_events_type_index\` on \`quote_events\` (\`type\`);`);
    this.addSql(`create index \`quote_events_actor_id_index\` on \`quote_events\` (\`actor_id\`);`);
    this.addSql(`create index \`quote_events_at_index\` on \`quote_events\` (\`at\`);`);

    this.addSql(`create table \`photos\` (\`id\` text not null, \`organization_id\` text not null, \`quote_id\` text not null, \`storage_key\` text not null, \`thumbnail_key\` text not null, \`content_type\` text not null, \`width\` integer not null, \`height\` integer not null, \`bytes\` integer not null, \`caption\` text not null default '', \`position\` integer not null default 0, \`on_quote\` integer not null, \`created_at\` datetime not null, \`version\` integer not null default 1, constraint \`photos_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`photos_quote_id_foreign\` foreign key(\`quote_id\`) references \`quotes\`(\`id\`) on delete cascade on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`photos_organization_id_index\` on \`photos\` (\`organization_id\`);`);
    this.addSql(`create index \`photos_quote_id_index\` on \`photos\` (\`quote_id\`);`);

    this.addSql(`create table \`import_jobs\` (\`id\` text not null, \`organization_id\` text not null, \`user_id\` text not null, \`supplier\` text not null default '', \`file_name\` text not null, \`storage_key\` text not null, \`state\` text not null, \`total_rows\` integer not null default 0, \`processed_rows\` integer not null default 0, \`created_count\` integer not null default 0, \`updated_count\` integer not null default 0, \`rejected_count\` integer not null default 0, \`rejections\` json not null, \`error\` text null, \`created_at\` datetime not null, \`finished_at\` datetime null, constraint \`import_jobs_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`import_jobs_user_id_foreign\` foreign key(\`user_id\`) references \`users\`(\`id\`) on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`import_jobs_organization_id_index\` on \`import_jobs\` (\`organization_id\`);`);
    this.addSql(`create index \`import_jobs_user_id_index\` on \`import_jobs\` (\`user_id\`);`);

    this.addSql(`alter table \`organizations\` add column \`vat_rounding\` text not null default 'line-nearest-1p';`);
    this.addSql(`alter table \`organizations\` add column \`quote_validity_days\` integer not null default 30;`);
  }

}
