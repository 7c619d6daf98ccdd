import { Migration } from '@mikro-orm/migrations';

// Each live asset's plan summary as the fleet overview shows it (outlook, next docking or campaign, the mass due
// there, the earliest renew-by date no planned docking meets), stored by the unit of work whenever what feeds the
// plan changes and valid for the UTC day it was computed for (`computed_on`): the fleet overview reads it with
// its asset list instead of forecasting every group on every request. `version` is new at every store, so a
// process may keep what it computed from the same data (the asset page's plan) until the version moves.
export class Migration20261210000000_asset_outlook extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "asset_outlook" ("asset_id" uuid not null, "organisation_id" uuid not null, "computed_on" date not null, "outlook" varchar(32) not null, "next_docking_id" uuid null, "mass_due_next_kg" double precision not null default 0, "renew_by" date null, "version" uuid not null default gen_random_uuid(), "updated_at" timestamptz not null default now(), constraint "asset_outlook_pkey" primary key ("asset_id"));`);
    this.addSql(`create index "asset_outlook_organisation_id_computed_on_index" on "asset_outlook" ("organisation_id", "computed_on");`);
    this.addSql(`alter table "asset_outlook" add constraint "asset_outlook_asset_id_foreign" foreign key ("asset_id") references "asset" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "asset_outlook" add constraint "asset_outlook_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "asset_outlook" add constraint "asset_outlook_next_docking_id_foreign" foreign key ("next_docking_id") references "docking" ("id") on update cascade on delete set null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "asset_outlook";`);
  }

}
