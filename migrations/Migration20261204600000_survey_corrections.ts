import { Migration } from '@mikro-orm/migrations';

// Survey corrections: the survey keeps the electrode its readings default to, a reading remembers that an
// under-protection alert named it (so a correction can be mailed), and a deleted survey waits 30 days in a bin.
export class Migration20261204600000_survey_corrections extends Migration {

  override async up(): Promise<void> {
    // Ag/AgCl/seawater was the form's default before the survey kept its choice.
    this.addSql(`alter table "survey" add column "default_electrode" varchar(24) not null default 'ag-agcl-seawater';`);
    this.addSql(`alter table "survey_reading" add column "alerted_at" timestamptz null;`);
    this.addSql(`create table "survey_bin" ("id" uuid not null, "organisation_id" uuid not null, "asset_id" uuid not null, "surveyed_on" date not null, "method" varchar(16) not null, "readings" int not null, "attachments" int not null, "deleted_at" timestamptz not null, "deleted_by_email" varchar(254) null, "payload" jsonb not null, constraint "survey_bin_pkey" primary key ("id"));`);
    this.addSql(`create index "survey_bin_organisation_id_deleted_at_index" on "survey_bin" ("organisation_id", "deleted_at");`);
    this.addSql(`alter table "survey_bin" add constraint "survey_bin_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "survey_bin" add constraint "survey_bin_asset_id_foreign" foreign key ("asset_id") references "asset" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "survey_bin";`);
    this.addSql(`alter table "survey_reading" drop column "alerted_at";`);
    this.addSql(`alter table "survey" drop column "default_electrode";`);
  }

}
