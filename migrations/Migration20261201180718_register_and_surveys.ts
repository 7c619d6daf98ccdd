import { Migration } from '@mikro-orm/migrations';

export class Migration20261201180718_register_and_surveys extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "survey" ("id" uuid not null, "organisation_id" uuid not null, "asset_id" uuid not null, "surveyed_on" date not null, "method" varchar(16) not null, "surveyor" varchar(120) null, "notes" text null, "created_by_id" uuid not null, "created_at" timestamptz not null, constraint "survey_pkey" primary key ("id"));`);
    this.addSql(`create index "survey_organisation_id_surveyed_on_index" on "survey" ("organisation_id", "surveyed_on");`);
    this.addSql(`create index "survey_asset_id_surveyed_on_index" on "survey" ("asset_id", "surveyed_on");`);

    this.addSql(`create table "survey_attachment" ("id" uuid not null, "organisation_id" uuid not null, "survey_id" uuid not null, "filename" varchar(200) not null, "content_type" varchar(60) not null, "size_bytes" int not null, "data" bytea not null, "caption" varchar(200) null, "uploaded_by_email" varchar(254) null, "created_at" timestamptz not null, constraint "survey_attachment_pkey" primary key ("id"));`);
    this.addSql(`create index "survey_attachment_survey_id_index" on "survey_attachment" ("survey_id");`);

    this.addSql(`create table "anode_group" ("id" uuid not null, "organisation_id" uuid not null, "asset_id" uuid not null, "zone_id" uuid null, "label" varchar(60) not null, "model" jsonb not null, "quantity" int not null, "positions" text null, "installed_on" date not null, "design_id" uuid null, "mean_current_a" double precision null, "removed_on" date null, "removal_reason" varchar(200) null, "replaces_group_id" uuid null, "notes" text null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "anode_group_pkey" primary key ("id"));`);
    this.addSql(`create index "anode_group_organisation_id_removed_on_index" on "anode_group" ("organisation_id", "removed_on");`);
    this.addSql(`create index "anode_group_asset_id_removed_on_index" on "anode_group" ("asset_id", "removed_on");`);

    this.addSql(`create table "survey_reading" ("id" uuid not null, "survey_id" uuid not null, "line" int null, "location" varchar(80) not null, "potential_v" double precision null, "electrode" varchar(24) null, "potential_ag_ag_cl_v" double precision null, "anode_group_id" uuid null, "remaining_fraction" double precision null, "comment" text null, constraint "survey_reading_pkey" primary key ("id"));`);
    this.addSql(`create index "survey_reading_survey_id_index" on "survey_reading" ("survey_id");`);
    this.addSql(`create index "survey_reading_anode_group_id_index" on "survey_reading" ("anode_group_id");`);

    this.addSql(`create table "anode_group_change" ("id" uuid not null, "group_id" uuid not null, "changed_by_email" varchar(254) null, "changes" jsonb not null, "created_at" timestamptz not null, constraint "anode_group_change_pkey" primary key ("id"));`);
    this.addSql(`create index "anode_group_change_group_id_index" on "anode_group_change" ("group_id");`);

    this.addSql(`alter table "survey" add constraint "survey_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "survey" add constraint "survey_asset_id_foreign" foreign key ("asset_id") references "asset" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "survey" add constraint "survey_created_by_id_foreign" foreign key ("created_by_id") references "app_user" ("id") on update cascade on delete restrict;`);

    this.addSql(`alter table "survey_attachment" add constraint "survey_attachment_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "survey_attachment" add constraint "survey_attachment_survey_id_foreign" foreign key ("survey_id") references "survey" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "anode_group" add constraint "anode_group_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "anode_group" add constraint "anode_group_asset_id_foreign" foreign key ("asset_id") references "asset" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "anode_group" add constraint "anode_group_zone_id_foreign" foreign key ("zone_id") references "zone" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "anode_group" add constraint "anode_group_design_id_foreign" foreign key ("design_id") references "design" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "survey_reading" add constraint "survey_reading_survey_id_foreign" foreign key ("survey_id") references "survey" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "survey_reading" add constraint "survey_reading_anode_group_id_foreign" foreign key ("anode_group_id") references "anode_group" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "anode_group_change" add constraint "anode_group_change_group_id_foreign" foreign key ("group_id") references "anode_group" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "survey_attachment" drop constraint "survey_attachment_survey_id_foreign";`);

    this.addSql(`alter table "survey_reading" drop constraint "survey_reading_survey_id_foreign";`);

    this.addSql(`alter table "survey_reading" drop constraint "survey_reading_anode_group_id_foreign";`);

    this.addSql(`alter table "anode_group_change" drop constraint "anode_group_change_group_id_foreign";`);

    this.addSql(`drop table if exists "survey" cascade;`);

    this.addSql(`drop table if exists "survey_attachment" cascade;`);

    this.addSql(`drop table if exists "anode_group" cascade;`);

    this.addSql(`drop table if exists "survey_reading" cascade;`);

    this.addSql(`drop table if exists "anode_group_change" cascade;`);
  }

}
