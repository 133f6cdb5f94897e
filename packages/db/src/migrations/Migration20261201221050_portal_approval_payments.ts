import { Migration } from '@mikro-orm/migrations';

export class Migration20261201221050_portal_approval_payments extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`payment_webhook_events\` (\`id\` text not null, \`organization_id\` text null, \`type\` text not null, \`outcome\` text not null, \`received_at\` datetime not null, constraint \`payment_webhook_events_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on delete set null on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`payment_webhook_events_organization_id_index\` on \`payment_webhook_events\` (\`organization_id\`);`);

    this.addSql(`create table \`quote_messages\` (\`id\` text not null, \`organization_id\` text not null, \`quote_id\` text not null, \`revision_id\` text null, \`from\` text not null, \`author_id\` text null, \`body\` text not null, \`at\` datetime not null, constraint \`quote_messages_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`quote_messages_quote_id_foreign\` foreign key(\`quote_id\`) references \`quotes\`(\`id\`) on delete cascade on update cascade, constraint \`quote_messages_revision_id_foreign\` foreign key(\`revision_id\`) references \`quote_revisions\`(\`id\`) on delete set null on update cascade, constraint \`quote_messages_author_id_foreign\` foreign key(\`author_id\`) references \`users\`(\`id\`) on delete set null on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`quote_messages_organization_id_index\` on \`quote_messages\` (\`organization_id\`);`);
    this.addSql(`create index \`quote_messages_quote_id_index\` on \`quote_messages\` (\`quote_id\`);`);
    this.addSql(`create index \`quote_messages_revision_id_index\` on \`quote_messages\` (\`revision_id\`);`);
    this.addSql(`create index \`quote_messages_author_id_index\` on \`quote_messages\` (\`author_id\`);`);
    this.addSql(`create index \`quote_messages_at_index\` on \`quote_messages\` (\`at\`);`);

    this.addSql(`create table \`quote_approvals\` (\`id\` text not null, \`organization_id\` text not null, \`quote_id\` text not null, \`revision_id\` text not null, \`selection\` json not null, \`totals\` json not null, \`total_minor\` integer not null, \`deposit_minor\` integer not null, \`currency\` text not null, \`signed_name\` text not null, \`terms_accepted\` integer not null, \`ip_address\` text not null, \`user_agent\` text not null default '', \`content_hash\` text not null, \`approved_at\` datetime not null, constraint \`quote_approvals_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`quote_approvals_quote_id_foreign\` foreign key(\`quote_id\`) references \`quotes\`(\`id\`) on delete cascade on update cascade, constraint \`quote_approvals_revision_id_foreign\` foreign key(\`revision_id\`) references \`quote_revisions\`(\`id\`) on delete cascade on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`quote_approvals_organization_id_index\` on \`quote_approvals\` (\`organization_id\`);`);
    this.addSql(`create index \`quote_approvals_quote_id_index\` on \`quote_approvals\` (\`quote_id\`);`);
    this.addSql(`create index \`quote_approvals_revision_id_index\` on \`quote_approvals\` (\`revision_id\`);`);
    this.addSql(`create unique index \`quote_approvals_revision_id_unique\` on \`quote_approvals\` (\`revision_id\`);`);

    this.addSql(`create table \`deposit_payments\` (\`id\` text not null, \`organization_id\` text not null, \`quote_id\` text not null, \`approval_id\` text not null, \`provider\` text not null default 'stripe', \`checkout_session_id\` text not null, \`payment_intent_id\` text null, \`amount_minor\` integer not null, \`currency\` text not null, \`state\` text not null, \`failure_code\` text null, \`paid_at\` datetime null, \`refunded_minor\` integer not null default 0, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`version\` integer not null default 1, constraint \`deposit_payments_organization_id_foreign\` foreign key(\`organization_id\`) references \`organizations\`(\`id\`) on update cascade, constraint \`deposit_payments_quote_id_foreign\` foreign key(\`quote_id\`) references \`quotes\`(\`id\`) on delete cascade on update cascade, constraint \`deposit_payments_approval_id_foreign\` foreign key(\`approval_id\`) references \`quote_approvals\`(\`id\`) on delete cascade on update cascade, primary key (\`id\`));`);
    this.addSql(`create index \`deposit_payments_organization_id_index\` on \`deposit_payments\` (\`organization_id\`);`);
    this.addSql(`create index \`deposit_payments_quote_id_index\` on \`deposit_payments\` (\`quote_id\`);`);
    this.addSql(`create index \`deposit_payments_approval_id_index\` on \`deposit_payments\` (\`approval_id\`);`);
    this.addSql(`create unique index \`deposit_payments_checkout_session_id_unique\` on \`deposit_payments\` (\`checkout_session_id\`);`);
    this.addSql(`create index \`deposit_payments_payment_intent_id_index\` on \`deposit_payments\` (\`payment_intent_id\`);`);
    this.addSql(`create index \`deposit_payments_state_index\` on \`deposit_payments\` (\`state\`);`);
  }

}
