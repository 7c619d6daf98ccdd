import { Migration } from '@mikro-orm/migrations';

export class Migration20261201181934_billing extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "stripe_event" ("id" varchar(80) not null, "type" varchar(80) not null, "organisation_id" uuid null, "outcome" varchar(16) not null, "detail" text null, "received_at" timestamptz not null, constraint "stripe_event_pkey" primary key ("id"));`);

    this.addSql(`alter table "organisation" add column "plan" varchar(16) null, add column "subscription_status" varchar(24) not null default 'trialing', add column "trial_ends_at" timestamptz null, add column "stripe_customer_id" varchar(64) null, add column "stripe_subscription_id" varchar(64) null, add column "current_period_end" timestamptz null, add column "cancel_at_period_end" boolean not null default false, add column "past_due_since" timestamptz null;`);
    this.addSql(`alter table "organisation" add constraint "organisation_stripe_customer_id_unique" unique ("stripe_customer_id");`);
    // Organisations created before billing get the same 30-day trial as new ones.
    this.addSql(`update "organisation" set "trial_ends_at" = "created_at" + interval '30 days' where "trial_ends_at" is null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "stripe_event" cascade;`);

    this.addSql(`alter table "organisation" drop constraint "organisation_stripe_customer_id_unique";`);
    this.addSql(`alter table "organisation" drop column "plan", drop column "subscription_status", drop column "trial_ends_at", drop column "stripe_customer_id", drop column "stripe_subscription_id", drop column "current_period_end", drop column "cancel_at_period_end", drop column "past_due_since";`);
  }

}
