import { Migration } from '@mikro-orm/migrations';

export class Migration20261201174640_initial extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "audit_event" ("id" uuid not null, "organisation_id" uuid null, "actor_user_id" uuid null, "actor_email" varchar(254) null, "action" varchar(64) not null, "target_type" varchar(64) null, "target_id" varchar(64) null, "details" jsonb null, "ip_address" varchar(64) null, "created_at" timestamptz not null, constraint "audit_event_pkey" primary key ("id"));`);
    this.addSql(`create index "audit_event_organisation_id_created_at_index" on "audit_event" ("organisation_id", "created_at");`);

    this.addSql(`create table "organisation" ("id" uuid not null, "slug" varchar(64) not null, "name" varchar(120) not null, "renewal_margin_months" int not null default 6, "fitting_rate_per_kg" double precision null, "currency" varchar(3) not null default 'EUR', "created_at" timestamptz not null, constraint "organisation_pkey" primary key ("id"));`);
    this.addSql(`alter table "organisation" add constraint "organisation_slug_unique" unique ("slug");`);

    this.addSql(`create table "outbox_message" ("id" uuid not null, "organisation_id" uuid null, "to_address" varchar(254) not null, "subject" varchar(250) not null, "text_body" text not null, "html_body" text null, "attachments" jsonb null, "dedupe_key" varchar(200) null, "status" varchar(12) not null default 'pending', "attempts" int not null default 0, "next_attempt_at" timestamptz not null, "last_error" text null, "sent_at" timestamptz null, "created_at" timestamptz not null, constraint "outbox_message_pkey" primary key ("id"));`);
    this.addSql(`alter table "outbox_message" add constraint "outbox_message_dedupe_key_unique" unique ("dedupe_key");`);
    this.addSql(`create index "outbox_message_status_next_attempt_at_index" on "outbox_message" ("status", "next_attempt_at");`);

    this.addSql(`create table "sign_in_attempt" ("id" uuid not null, "email" varchar(254) not null, "ip_address" varchar(64) not null, "succeeded" boolean not null, "created_at" timestamptz not null, constraint "sign_in_attempt_pkey" primary key ("id"));`);
    this.addSql(`create index "sign_in_attempt_email_created_at_index" on "sign_in_attempt" ("email", "created_at");`);
    this.addSql(`create index "sign_in_attempt_ip_address_created_at_index" on "sign_in_attempt" ("ip_address", "created_at");`);

    this.addSql(`create table "app_user" ("id" uuid not null, "email" varchar(254) not null, "name" varchar(120) not null, "password_hash" text not null, "email_verified_at" timestamptz null, "created_at" timestamptz not null, constraint "app_user_pkey" primary key ("id"));`);
    this.addSql(`alter table "app_user" add constraint "app_user_email_unique" unique ("email");`);

    this.addSql(`create table "auth_session" ("id" varchar(64) not null, "user_id" uuid not null, "expires_at" timestamptz not null, constraint "auth_session_pkey" primary key ("id"));`);
    this.addSql(`create index "auth_session_user_id_index" on "auth_session" ("user_id");`);

    this.addSql(`create table "membership" ("id" uuid not null, "organisation_id" uuid not null, "user_id" uuid not null, "role" varchar(16) not null, "created_at" timestamptz not null, constraint "membership_pkey" primary key ("id"));`);
    this.addSql(`create index "membership_user_id_index" on "membership" ("user_id");`);
    this.addSql(`alter table "membership" add constraint "membership_organisation_id_user_id_unique" unique ("organisation_id", "user_id");`);

    this.addSql(`create table "invitation" ("id" uuid not null, "organisation_id" uuid not null, "email" varchar(254) not null, "role" varchar(16) not null, "token_hash" varchar(64) not null, "invited_by_id" uuid null, "expires_at" timestamptz not null, "accepted_at" timestamptz null, "revoked_at" timestamptz null, "created_at" timestamptz not null, constraint "invitation_pkey" primary key ("id"));`);
    this.addSql(`alter table "invitation" add constraint "invitation_token_hash_unique" unique ("token_hash");`);

    this.addSql(`create table "user_token" ("id" uuid not null, "user_id" uuid not null, "kind" varchar(32) not null, "token_hash" varchar(64) not null, "expires_at" timestamptz not null, "used_at" timestamptz null, "created_at" timestamptz not null, constraint "user_token_pkey" primary key ("id"));`);
    this.addSql(`create index "user_token_user_id_index" on "user_token" ("user_id");`);
    this.addSql(`alter table "user_token" add constraint "user_token_token_hash_unique" unique ("token_hash");`);

    this.addSql(`alter table "auth_session" add constraint "auth_session_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "membership" add constraint "membership_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "membership" add constraint "membership_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "invitation" add constraint "invitation_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "invitation" add constraint "invitation_invited_by_id_foreign" foreign key ("invited_by_id") references "app_user" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "user_token" add constraint "user_token_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "membership" drop constraint "membership_organisation_id_foreign";`);

    this.addSql(`alter table "invitation" drop constraint "invitation_organisation_id_foreign";`);

    this.addSql(`alter table "auth_session" drop constraint "auth_session_user_id_foreign";`);

    this.addSql(`alter table "membership" drop constraint "membership_user_id_foreign";`);

    this.addSql(`alter table "invitation" drop constraint "invitation_invited_by_id_foreign";`);

    this.addSql(`alter table "user_token" drop constraint "user_token_user_id_foreign";`);

    this.addSql(`drop table if exists "audit_event" cascade;`);

    this.addSql(`drop table if exists "organisation" cascade;`);

    this.addSql(`drop table if exists "outbox_message" cascade;`);

    this.addSql(`drop table if exists "sign_in_attempt" cascade;`);

    this.addSql(`drop table if exists "app_user" cascade;`);

    this.addSql(`drop table if exists "auth_session" cascade;`);

    this.addSql(`drop table if exists "membership" cascade;`);

    this.addSql(`drop table if exists "invitation" cascade;`);

    this.addSql(`drop table if exists "user_token" cascade;`);
  }

}
