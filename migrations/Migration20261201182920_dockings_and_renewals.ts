import { Migration } from '@mikro-orm/migrations';

export class Migration20261201182920_dockings_and_renewals extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "docking" ("id" uuid not null, "organisation_id" uuid not null, "asset_id" uuid not null, "kind" varchar(16) not null, "status" varchar(12) not null default 'planned', "planned_start" date not null, "planned_end" date null, "actual_start" date null, "actual_end" date null, "yard" varchar(120) null, "reference" varchar(60) null, "notes" text null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "docking_pkey" primary key ("id"));`);
    this.addSql(`create index "docking_organisation_id_planned_start_index" on "docking" ("organisation_id", "planned_start");`);
    this.addSql(`create index "docking_asset_id_planned_start_index" on "docking" ("asset_id", "planned_start");`);

    this.addSql(`create table "renewal" ("id" uuid not null, "organisation_id" uuid not null, "docking_id" uuid not null, "group_id" uuid not null, "status" varchar(12) not null default 'proposed', "reason" varchar(24) not null, "quantity" int not null, "notes" text null, "rationale" text null, "confirmed_by_email" varchar(254) null, "confirmed_at" timestamptz null, "fitted_on" date null, "new_group_id" uuid null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "renewal_pkey" primary key ("id"));`);
    this.addSql(`create index "renewal_docking_id_status_index" on "renewal" ("docking_id", "status");`);
    this.addSql(`create index "renewal_group_id_status_index" on "renewal" ("group_id", "status");`);

    this.addSql(`alter table "docking" add constraint "docking_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "docking" add constraint "docking_asset_id_foreign" foreign key ("asset_id") references "asset" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "renewal" add constraint "renewal_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "renewal" add constraint "renewal_docking_id_foreign" foreign key ("docking_id") references "docking" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "renewal" add constraint "renewal_group_id_foreign" foreign key ("group_id") references "anode_group" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "organisation" add column "last_digest_at" timestamptz null;`);

    this.addSql(`alter table "asset" add column "outlook" varchar(32) null, add column "outlook_changed_at" timestamptz null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "renewal" drop constraint "renewal_docking_id_foreign";`);

    this.addSql(`drop table if exists "docking" cascade;`);

    this.addSql(`drop table if exists "renewal" cascade;`);

    this.addSql(`alter table "asset" drop column "outlook", drop column "outlook_changed_at";`);

    this.addSql(`alter table "organisation" drop column "last_digest_at";`);
  }

}
