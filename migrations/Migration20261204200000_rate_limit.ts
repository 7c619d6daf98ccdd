import { Migration } from '@mikro-orm/migrations';

// Counters of the rate limits (rate-limiter-flexible's PostgreSQL store, shared by every app instance):
// one row per key, the points used in the current window and when the window ends (epoch milliseconds).
// They replace the sign-in attempt log, which counted failures per account and per address.
export class Migration20261204200000_rate_limit extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "rate_limit" ("key" varchar(255) not null, "points" integer not null default 0, "expire" bigint null, constraint "rate_limit_pkey" primary key ("key"));`);
    this.addSql(`create index "rate_limit_expire_index" on "rate_limit" ("expire");`);
    this.addSql(`drop table if exists "sign_in_attempt" cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "rate_limit" cascade;`);
    this.addSql(`create table "sign_in_attempt" ("id" uuid not null, "email" varchar(254) not null, "ip_address" varchar(64) not null, "succeeded" boolean not null, "created_at" timestamptz not null, constraint "sign_in_attempt_pkey" primary key ("id"));`);
    this.addSql(`create index "sign_in_attempt_email_created_at_index" on "sign_in_attempt" ("email", "created_at");`);
    this.addSql(`create index "sign_in_attempt_ip_address_created_at_index" on "sign_in_attempt" ("ip_address", "created_at");`);
  }

}
