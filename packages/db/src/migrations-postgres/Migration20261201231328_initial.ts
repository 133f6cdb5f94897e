import { Migration } from '@mikro-orm/migrations';

export class Migration20261201231328_initial extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "organizations" ("id" varchar(255) not null, "name" varchar(255) not null, "address_lines" text not null default '', "vat_number" varchar(255) null, "currency" varchar(3) not null default 'GBP', "locale" varchar(255) not null default 'en-GB', "vat_rate_bp" int not null default 2000, "deposit_percent_bp" int not null default 3000, "markup_percent_bp" int not null default 3500, "labour_rate_minor_per_hour" int not null default 4500, "vat_rounding" varchar(255) not null default 'line-nearest-1p', "quote_validity_days" int not null default 30, "terms_text" text not null default '', "logo_path" varchar(255) null, "logo_content_type" varchar(255) null, "vat_rates_bp" jsonb null, "design_settings" jsonb null, "email_sender_name" varchar(255) not null default '', "created_at" timestamptz not null, "updated_at" timestamptz not null, "version" int not null default 1, constraint "organizations_pkey" primary key ("id"));`);

    this.addSql(`create table "import_mappings" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "supplier" varchar(255) not null, "columns" jsonb not null, "updated_at" timestamptz not null, constraint "import_mappings_pkey" primary key ("id"));`);
    this.addSql(`create index "import_mappings_organization_id_index" on "import_mappings" ("organization_id");`);
    this.addSql(`alter table "import_mappings" add constraint "import_mappings_organization_id_supplier_unique" unique ("organization_id", "supplier");`);

    this.addSql(`create table "customers" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "name" varchar(255) not null, "email" varchar(255) null, "phone" varchar(255) null, "notes" text not null default '', "created_at" timestamptz not null, "updated_at" timestamptz not null, "version" int not null default 1, constraint "customers_pkey" primary key ("id"));`);
    this.addSql(`create index "customers_organization_id_index" on "customers" ("organization_id");`);

    this.addSql(`create table "outbox_messages" ("id" varchar(255) not null, "organization_id" varchar(255) null, "kind" varchar(255) not null, "reference" varchar(255) null, "to" varchar(255) not null, "subject" varchar(255) not null, "text" text not null, "html" text null, "attachments" jsonb not null, "status" varchar(255) not null default 'pending', "attempts" int not null default 0, "next_attempt_at" timestamptz not null, "last_error" text null, "sent_at" timestamptz null, "created_at" timestamptz not null, constraint "outbox_messages_pkey" primary key ("id"));`);
    this.addSql(`create index "outbox_messages_organization_id_index" on "outbox_messages" ("organization_id");`);
    this.addSql(`create index "outbox_messages_reference_index" on "outbox_messages" ("reference");`);
    this.addSql(`create index "outbox_messages_status_index" on "outbox_messages" ("status");`);
    this.addSql(`create index "outbox_messages_next_attempt_at_index" on "outbox_messages" ("next_attempt_at");`);

    this.addSql(`create table "payment_webhook_events" ("id" varchar(255) not null, "organization_id" varchar(255) null, "type" varchar(255) not null, "outcome" varchar(255) not null, "received_at" timestamptz not null, constraint "payment_webhook_events_pkey" primary key ("id"));`);
    this.addSql(`create index "payment_webhook_events_organization_id_index" on "payment_webhook_events" ("organization_id");`);

    this.addSql(`create table "products" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "kind" varchar(255) not null, "supplier" varchar(255) not null, "supplier_code" varchar(255) not null, "name" varchar(255) not null, "description" text not null default '', "unit" varchar(255) not null default 'each', "cost_minor" int not null default 0, "list_price_minor" int not null default 0, "active" boolean not null, "spec" jsonb not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "version" int not null default 1, constraint "products_pkey" primary key ("id"));`);
    this.addSql(`create index "products_organization_id_index" on "products" ("organization_id");`);
    this.addSql(`create index "products_kind_index" on "products" ("kind");`);
    this.addSql(`alter table "products" add constraint "products_organization_id_supplier_supplier_code_unique" unique ("organization_id", "supplier", "supplier_code");`);

    this.addSql(`create table "rate_limit_counters" ("key" varchar(255) not null, "hits" int not null, "reset_at" timestamptz not null, constraint "rate_limit_counters_pkey" primary key ("key"));`);
    this.addSql(`create index "rate_limit_counters_reset_at_index" on "rate_limit_counters" ("reset_at");`);

    this.addSql(`create table "sites" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "customer_id" varchar(255) not null, "label" varchar(255) not null default '', "address_lines" text not null, "postcode" varchar(255) not null default '', "access_notes" text not null default '', "created_at" timestamptz not null, "version" int not null default 1, constraint "sites_pkey" primary key ("id"));`);
    this.addSql(`create index "sites_organization_id_index" on "sites" ("organization_id");`);
    this.addSql(`create index "sites_customer_id_index" on "sites" ("customer_id");`);

    this.addSql(`create table "users" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "email" varchar(255) not null, "name" varchar(255) not null, "password_hash" varchar(255) null, "role" varchar(255) not null, "active" boolean not null default true, "created_at" timestamptz not null, "last_sign_in_at" timestamptz null, "version" int not null default 1, constraint "users_pkey" primary key ("id"));`);
    this.addSql(`create index "users_organization_id_index" on "users" ("organization_id");`);
    this.addSql(`alter table "users" add constraint "users_email_unique" unique ("email");`);

    this.addSql(`create table "sessions" ("id" varchar(255) not null, "user_id" varchar(255) not null, "organization_id" varchar(255) not null, "expires_at" timestamptz not null, "created_at" timestamptz not null, constraint "sessions_pkey" primary key ("id"));`);
    this.addSql(`create index "sessions_user_id_index" on "sessions" ("user_id");`);
    this.addSql(`create index "sessions_organization_id_index" on "sessions" ("organization_id");`);

    this.addSql(`create table "quotes" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "number" int not null, "title" varchar(255) not null default '', "customer_id" varchar(255) not null, "site_id" varchar(255) null, "estimator_id" varchar(255) not null, "status" varchar(255) not null, "value_minor" int not null default 0, "valid_until" timestamptz null, "sent_at" timestamptz null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "version" int not null default 1, constraint "quotes_pkey" primary key ("id"));`);
    this.addSql(`create index "quotes_organization_id_index" on "quotes" ("organization_id");`);
    this.addSql(`create index "quotes_customer_id_index" on "quotes" ("customer_id");`);
    this.addSql(`create index "quotes_estimator_id_index" on "quotes" ("estimator_id");`);
    this.addSql(`create index "quotes_status_index" on "quotes" ("status");`);
    this.addSql(`alter table "quotes" add constraint "quotes_organization_id_number_unique" unique ("organization_id", "number");`);

    this.addSql(`create table "quote_revisions" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "quote_id" varchar(255) not null, "number" int not null, "state" varchar(255) not null, "content" jsonb not null, "settings" jsonb not null, "totals" jsonb null, "content_hash" varchar(255) null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "sent_at" timestamptz null, "version" int not null default 1, constraint "quote_revisions_pkey" primary key ("id"));`);
    this.addSql(`create index "quote_revisions_organization_id_index" on "quote_revisions" ("organization_id");`);
    this.addSql(`create index "quote_revisions_quote_id_index" on "quote_revisions" ("quote_id");`);
    this.addSql(`alter table "quote_revisions" add constraint "quote_revisions_quote_id_number_unique" unique ("quote_id", "number");`);

    this.addSql(`create table "portal_tokens" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "revision_id" varchar(255) not null, "token_hash" varchar(255) not null, "sent_to" varchar(255) not null, "expires_at" timestamptz not null, "revoked_at" timestamptz null, "created_at" timestamptz not null, constraint "portal_tokens_pkey" primary key ("id"));`);
    this.addSql(`create index "portal_tokens_organization_id_index" on "portal_tokens" ("organization_id");`);
    this.addSql(`create index "portal_tokens_revision_id_index" on "portal_tokens" ("revision_id");`);
    this.addSql(`alter table "portal_tokens" add constraint "portal_tokens_token_hash_unique" unique ("token_hash");`);

    this.addSql(`create table "circuits" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "revision_id" varchar(255) not null, "area" varchar(255) not null, "name" varchar(255) not null default '', "kind" varchar(255) not null, "position" int not null, "design" jsonb not null, "result" jsonb not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "version" int not null default 1, constraint "circuits_pkey" primary key ("id"));`);
    this.addSql(`create index "circuits_organization_id_index" on "circuits" ("organization_id");`);
    this.addSql(`create index "circuits_revision_id_index" on "circuits" ("revision_id");`);

    this.addSql(`create table "quote_messages" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "quote_id" varchar(255) not null, "revision_id" varchar(255) null, "from" varchar(255) not null, "author_id" varchar(255) null, "body" text not null, "at" timestamptz not null, constraint "quote_messages_pkey" primary key ("id"));`);
    this.addSql(`create index "quote_messages_organization_id_index" on "quote_messages" ("organization_id");`);
    this.addSql(`create index "quote_messages_quote_id_index" on "quote_messages" ("quote_id");`);
    this.addSql(`create index "quote_messages_at_index" on "quote_messages" ("at");`);

    this.addSql(`create table "quote_events" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "quote_id" varchar(255) not null, "revision_id" varchar(255) null, "type" varchar(255) not null, "actor_id" varchar(255) null, "data" jsonb not null, "at" timestamptz not null, constraint "quote_events_pkey" primary key ("id"));`);
    this.addSql(`create index "quote_events_organization_id_index" on "quote_events" ("organization_id");`);
    this.addSql(`create index "quote_events_quote_id_index" on "quote_events" ("quote_id");`);
    this.addSql(`create index "quote_events_type_index" on "quote_events" ("type");`);
    this.addSql(`create index "quote_events_at_index" on "quote_events" ("at");`);

    this.addSql(`create table "quote_approvals" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "quote_id" varchar(255) not null, "revision_id" varchar(255) not null, "selection" jsonb not null, "totals" jsonb not null, "total_minor" int not null, "deposit_minor" int not null, "currency" varchar(255) not null, "signed_name" varchar(255) not null, "terms_accepted" boolean not null, "ip_address" varchar(255) not null, "user_agent" varchar(255) not null default '', "content_hash" varchar(255) not null, "approved_at" timestamptz not null, constraint "quote_approvals_pkey" primary key ("id"));`);
    this.addSql(`create index "quote_approvals_organization_id_index" on "quote_approvals" ("organization_id");`);
    this.addSql(`create index "quote_approvals_quote_id_index" on "quote_approvals" ("quote_id");`);
    this.addSql(`alter table "quote_approvals" add constraint "quote_approvals_revision_id_unique" unique ("revision_id");`);

    this.addSql(`create table "photos" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "quote_id" varchar(255) not null, "storage_key" varchar(255) not null, "thumbnail_key" varchar(255) not null, "content_type" varchar(255) not null, "width" int not null, "height" int not null, "bytes" int not null, "caption" varchar(255) not null default '', "position" int not null default 0, "on_quote" boolean not null, "created_at" timestamptz not null, "version" int not null default 1, constraint "photos_pkey" primary key ("id"));`);
    this.addSql(`create index "photos_organization_id_index" on "photos" ("organization_id");`);
    this.addSql(`create index "photos_quote_id_index" on "photos" ("quote_id");`);

    this.addSql(`create table "deposit_payments" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "quote_id" varchar(255) not null, "approval_id" varchar(255) not null, "provider" varchar(255) not null default 'stripe', "checkout_session_id" varchar(255) not null, "payment_intent_id" varchar(255) null, "amount_minor" int not null, "currency" varchar(255) not null, "state" varchar(255) not null, "failure_code" varchar(255) null, "paid_at" timestamptz null, "refunded_minor" int not null default 0, "created_at" timestamptz not null, "updated_at" timestamptz not null, "version" int not null default 1, constraint "deposit_payments_pkey" primary key ("id"));`);
    this.addSql(`create index "deposit_payments_organization_id_index" on "deposit_payments" ("organization_id");`);
    this.addSql(`create index "deposit_payments_quote_id_index" on "deposit_payments" ("quote_id");`);
    this.addSql(`create index "deposit_payments_approval_id_index" on "deposit_payments" ("approval_id");`);
    this.addSql(`alter table "deposit_payments" add constraint "deposit_payments_checkout_session_id_unique" unique ("checkout_session_id");`);
    this.addSql(`create index "deposit_payments_payment_intent_id_index" on "deposit_payments" ("payment_intent_id");`);
    this.addSql(`create index "deposit_payments_state_index" on "deposit_payments" ("state");`);

    this.addSql(`create table "import_jobs" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "user_id" varchar(255) not null, "supplier" varchar(255) not null default '', "file_name" varchar(255) not null, "storage_key" varchar(255) not null, "state" varchar(255) not null, "total_rows" int not null default 0, "processed_rows" int not null default 0, "created_count" int not null default 0, "updated_count" int not null default 0, "rejected_count" int not null default 0, "rejections" json not null, "error" text null, "created_at" timestamptz not null, "finished_at" timestamptz null, constraint "import_jobs_pkey" primary key ("id"));`);
    this.addSql(`create index "import_jobs_organization_id_index" on "import_jobs" ("organization_id");`);

    this.addSql(`create table "firm_events" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "type" varchar(255) not null, "actor_id" varchar(255) null, "subject_id" varchar(255) null, "data" jsonb not null, "at" timestamptz not null, constraint "firm_events_pkey" primary key ("id"));`);
    this.addSql(`create index "firm_events_organization_id_index" on "firm_events" ("organization_id");`);
    this.addSql(`create index "firm_events_at_index" on "firm_events" ("at");`);

    this.addSql(`create table "commissioning_records" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "quote_id" varchar(255) not null, "circuit_id" varchar(255) not null, "readings" jsonb not null, "checks" jsonb not null, "note" varchar(255) not null default '', "flagged" int not null default 0, "recorded_by_id" varchar(255) null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "version" int not null default 1, constraint "commissioning_records_pkey" primary key ("id"));`);
    this.addSql(`create index "commissioning_records_organization_id_index" on "commissioning_records" ("organization_id");`);
    this.addSql(`create index "commissioning_records_quote_id_index" on "commissioning_records" ("quote_id");`);
    this.addSql(`alter table "commissioning_records" add constraint "commissioning_records_circuit_id_unique" unique ("circuit_id");`);

    this.addSql(`create table "circuit_as_wired" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "circuit_id" varchar(255) not null, "blocks" jsonb not null, "safe" boolean not null, "recorded_by_id" varchar(255) null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "version" int not null default 1, constraint "circuit_as_wired_pkey" primary key ("id"));`);
    this.addSql(`create index "circuit_as_wired_organization_id_index" on "circuit_as_wired" ("organization_id");`);
    this.addSql(`alter table "circuit_as_wired" add constraint "circuit_as_wired_circuit_id_unique" unique ("circuit_id");`);

    this.addSql(`create table "auth_tokens" ("id" varchar(255) not null, "organization_id" varchar(255) not null, "user_id" varchar(255) not null, "purpose" varchar(255) not null, "token_hash" varchar(255) not null, "expires_at" timestamptz not null, "used_at" timestamptz null, "created_at" timestamptz not null, constraint "auth_tokens_pkey" primary key ("id"));`);
    this.addSql(`create index "auth_tokens_organization_id_index" on "auth_tokens" ("organization_id");`);
    this.addSql(`create index "auth_tokens_user_id_index" on "auth_tokens" ("user_id");`);
    this.addSql(`alter table "auth_tokens" add constraint "auth_tokens_token_hash_unique" unique ("token_hash");`);

    this.addSql(`alter table "import_mappings" add constraint "import_mappings_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);

    this.addSql(`alter table "customers" add constraint "customers_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);

    this.addSql(`alter table "outbox_messages" add constraint "outbox_messages_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "payment_webhook_events" add constraint "payment_webhook_events_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "products" add constraint "products_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);

    this.addSql(`alter table "sites" add constraint "sites_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "sites" add constraint "sites_customer_id_foreign" foreign key ("customer_id") references "customers" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "users" add constraint "users_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);

    this.addSql(`alter table "sessions" add constraint "sessions_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "sessions" add constraint "sessions_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);

    this.addSql(`alter table "quotes" add constraint "quotes_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "quotes" add constraint "quotes_customer_id_foreign" foreign key ("customer_id") references "customers" ("id") on update cascade;`);
    this.addSql(`alter table "quotes" add constraint "quotes_site_id_foreign" foreign key ("site_id") references "sites" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "quotes" add constraint "quotes_estimator_id_foreign" foreign key ("estimator_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "quote_revisions" add constraint "quote_revisions_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "quote_revisions" add constraint "quote_revisions_quote_id_foreign" foreign key ("quote_id") references "quotes" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "portal_tokens" add constraint "portal_tokens_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "portal_tokens" add constraint "portal_tokens_revision_id_foreign" foreign key ("revision_id") references "quote_revisions" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "circuits" add constraint "circuits_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "circuits" add constraint "circuits_revision_id_foreign" foreign key ("revision_id") references "quote_revisions" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "quote_messages" add constraint "quote_messages_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "quote_messages" add constraint "quote_messages_quote_id_foreign" foreign key ("quote_id") references "quotes" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "quote_messages" add constraint "quote_messages_revision_id_foreign" foreign key ("revision_id") references "quote_revisions" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "quote_messages" add constraint "quote_messages_author_id_foreign" foreign key ("author_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "quote_events" add constraint "quote_events_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "quote_events" add constraint "quote_events_quote_id_foreign" foreign key ("quote_id") references "quotes" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "quote_events" add constraint "quote_events_revision_id_foreign" foreign key ("revision_id") references "quote_revisions" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "quote_events" add constraint "quote_events_actor_id_foreign" foreign key ("actor_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "quote_approvals" add constraint "quote_approvals_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "quote_approvals" add constraint "quote_approvals_quote_id_foreign" foreign key ("quote_id") references "quotes" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "quote_approvals" add constraint "quote_approvals_revision_id_foreign" foreign key ("revision_id") references "quote_revisions" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "photos" add constraint "photos_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "photos" add constraint "photos_quote_id_foreign" foreign key ("quote_id") references "quotes" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "deposit_payments" add constraint "deposit_payments_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "deposit_payments" add constraint "deposit_payments_quote_id_foreign" foreign key ("quote_id") references "quotes" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "deposit_payments" add constraint "deposit_payments_approval_id_foreign" foreign key ("approval_id") references "quote_approvals" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "import_jobs" add constraint "import_jobs_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "import_jobs" add constraint "import_jobs_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "firm_events" add constraint "firm_events_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "firm_events" add constraint "firm_events_actor_id_foreign" foreign key ("actor_id") references "users" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "firm_events" add constraint "firm_events_subject_id_foreign" foreign key ("subject_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "commissioning_records" add constraint "commissioning_records_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "commissioning_records" add constraint "commissioning_records_quote_id_foreign" foreign key ("quote_id") references "quotes" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "commissioning_records" add constraint "commissioning_records_circuit_id_foreign" foreign key ("circuit_id") references "circuits" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "commissioning_records" add constraint "commissioning_records_recorded_by_id_foreign" foreign key ("recorded_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "circuit_as_wired" add constraint "circuit_as_wired_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "circuit_as_wired" add constraint "circuit_as_wired_circuit_id_foreign" foreign key ("circuit_id") references "circuits" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "circuit_as_wired" add constraint "circuit_as_wired_recorded_by_id_foreign" foreign key ("recorded_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "auth_tokens" add constraint "auth_tokens_organization_id_foreign" foreign key ("organization_id") references "organizations" ("id") on update cascade;`);
    this.addSql(`alter table "auth_tokens" add constraint "auth_tokens_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "import_mappings" drop constraint "import_mappings_organization_id_foreign";`);

    this.addSql(`alter table "customers" drop constraint "customers_organization_id_foreign";`);

    this.addSql(`alter table "outbox_messages" drop constraint "outbox_messages_organization_id_foreign";`);

    this.addSql(`alter table "payment_webhook_events" drop constraint "payment_webhook_events_organization_id_foreign";`);

    this.addSql(`alter table "products" drop constraint "products_organization_id_foreign";`);

    this.addSql(`alter table "sites" drop constraint "sites_organization_id_foreign";`);

    this.addSql(`alter table "users" drop constraint "users_organization_id_foreign";`);

    this.addSql(`alter table "sessions" drop constraint "sessions_organization_id_foreign";`);

    this.addSql(`alter table "quotes" drop constraint "quotes_organization_id_foreign";`);

    this.addSql(`alter table "quote_revisions" drop constraint "quote_revisions_organization_id_foreign";`);

    this.addSql(`alter table "portal_tokens" drop constraint "portal_tokens_organization_id_foreign";`);

    this.addSql(`alter table "circuits" drop constraint "circuits_organization_id_foreign";`);

    this.addSql(`alter table "quote_messages" drop constraint "quote_messages_organization_id_foreign";`);

    this.addSql(`alter table "quote_events" drop constraint "quote_events_organization_id_foreign";`);

    this.addSql(`alter table "quote_approvals" drop constraint "quote_approvals_organization_id_foreign";`);

    this.addSql(`alter table "photos" drop constraint "photos_organization_id_foreign";`);

    this.addSql(`alter table "deposit_payments" drop constraint "deposit_payments_organization_id_foreign";`);

    this.addSql(`alter table "import_jobs" drop constraint "import_jobs_organization_id_foreign";`);

    this.addSql(`alter table "firm_events" drop constraint "firm_events_organization_id_foreign";`);

    this.addSql(`alter table "commissioning_records" drop constraint "commissioning_records_organization_id_foreign";`);

    this.addSql(`alter table "circuit_as_wired" drop constraint "circuit_as_wired_organization_id_foreign";`);

    this.addSql(`alter table "auth_tokens" drop constraint "auth_tokens_organization_id_foreign";`);

    this.addSql(`alter table "sites" drop constraint "sites_customer_id_foreign";`);

    this.addSql(`alter table "quotes" drop constraint "quotes_customer_id_foreign";`);

    this.addSql(`alter table "quotes" drop constraint "quotes_site_id_foreign";`);

    this.addSql(`alter table "sessions" drop constraint "sessions_user_id_foreign";`);

    this.addSql(`alter table "quotes" drop constraint "quotes_estimator_id_foreign";`);

    this.addSql(`alter table "quote_messages" drop constraint "quote_messages_author_id_foreign";`);

    this.addSql(`alter table "quote_events" drop constraint "quote_events_actor_id_foreign";`);

    this.addSql(`alter table "import_jobs" drop constraint "import_jobs_user_id_foreign";`);

    this.addSql(`alter table "firm_events" drop constraint "firm_events_actor_id_foreign";`);

    this.addSql(`alter table "firm_events" drop constraint "firm_events_subject_id_foreign";`);

    this.addSql(`alter table "commissioning_records" drop constraint "commissioning_records_recorded_by_id_foreign";`);

    this.addSql(`alter table "circuit_as_wired" drop constraint "circuit_as_wired_recorded_by_id_foreign";`);

    this.addSql(`alter table "auth_tokens" drop constraint "auth_tokens_user_id_foreign";`);

    this.addSql(`alter table "quote_revisions" drop constraint "quote_revisions_quote_id_foreign";`);

    this.addSql(`alter table "quote_messages" drop constraint "quote_messages_quote_id_foreign";`);

    this.addSql(`alter table "quote_events" drop constraint "quote_events_quote_id_foreign";`);

    this.addSql(`alter table "quote_approvals" drop constraint "quote_approvals_quote_id_foreign";`);

    this.addSql(`alter table "photos" drop constraint "photos_quote_id_foreign";`);

    this.addSql(`alter table "deposit_payments" drop constraint "deposit_payments_quote_id_foreign";`);

    this.addSql(`alter table "commissioning_records" drop constraint "commissioning_records_quote_id_foreign";`);

    this.addSql(`alter table "portal_tokens" drop constraint "portal_tokens_revision_id_foreign";`);

    this.addSql(`alter table "circuits" drop constraint "circuits_revision_id_foreign";`);

    this.addSql(`alter table "quote_messages" drop constraint "quote_messages_revision_id_foreign";`);

    this.addSql(`alter table "quote_events" drop constraint "quote_events_revision_id_foreign";`);

    this.addSql(`alter table "quote_approvals" drop constraint "quote_approvals_revision_id_foreign";`);

    this.addSql(`alter table "commissioning_records" drop constraint "commissioning_records_circuit_id_foreign";`);

    this.addSql(`alter table "circuit_as_wired" drop constraint "circuit_as_wired_circuit_id_foreign";`);

    this.addSql(`alter table "deposit_payments" drop constraint "deposit_payments_approval_id_foreign";`);

    this.addSql(`drop table if exists "organizations" cascade;`);

    this.addSql(`drop table if exists "import_mappings" cascade;`);

    this.addSql(`drop table if exists "customers" cascade;`);

    this.addSql(`drop table if exists "outbox_messages" cascade;`);

    this.addSql(`drop table if exists "payment_webhook_events" cascade;`);

    this.addSql(`drop table if exists "products" cascade;`);

    this.addSql(`drop table if exists "rate_limit_counters" cascade;`);

    this.addSql(`drop table if exists "sites" cascade;`);

    this.addSql(`drop table if exists "users" cascade;`);

    this.addSql(`drop table if exists "sessions" cascade;`);

    this.addSql(`drop table if exists "quotes" cascade;`);

    this.addSql(`drop table if exists "quote_revisions" cascade;`);

    this.addSql(`drop table if exists "portal_tokens" cascade;`);

    this.addSql(`drop table if exists "circuits" cascade;`);

    this.addSql(`drop table if exists "quote_messages" cascade;`);

    this.addSql(`drop table if exists "quote_events" cascade;`);

    this.addSql(`drop table if exists "quote_approvals" cascade;`);

    this.addSql(`drop table if exists "photos" cascade;`);

    this.addSql(`drop table if exists "deposit_payments" cascade;`);

    this.addSql(`drop table if exists "import_jobs" cascade;`);

    this.addSql(`drop table if exists "firm_events" cascade;`);

    this.addSql(`drop table if exists "commissioning_records" cascade;`);

    this.addSql(`drop table if exists "circuit_as_wired" cascade;`);

    this.addSql(`drop table if exists "auth_tokens" cascade;`);
  }

}
