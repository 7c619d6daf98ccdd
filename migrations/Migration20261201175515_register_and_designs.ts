import { Migration } from '@mikro-orm/migrations';

export class Migration20261201175515_register_and_designs extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "asset" ("id" uuid not null, "organisation_id" uuid not null, "kind" varchar(16) not null, "name" varchar(120) not null, "notes" text null, "imo_number" varchar(7) null, "vessel_type" varchar(60) null, "length_bpp_m" double precision null, "beam_m" double precision null, "draught_m" double precision null, "block_coefficient" double precision null, "hull_material" varchar(16) null, "has_impressed_current" boolean not null default false, "trading_waters" varchar(120) null, "structure_type" varchar(32) null, "location" varchar(120) null, "water_type" varchar(16) null, "design_life_years" double precision null, "pile_count" int null, "pile_diameter_m" double precision null, "archived_at" timestamptz null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "asset_pkey" primary key ("id"));`);
    this.addSql(`create index "asset_organisation_id_archived_at_name_index" on "asset" ("organisation_id", "archived_at", "name");`);

    this.addSql(`create table "anode_model" ("id" uuid not null, "organisation_id" uuid not null, "designation" varchar(60) not null, "alloy" varchar(32) not null, "mounting" varchar(16) not null, "shape" jsonb not null, "dimensions" jsonb not null, "net_mass_kg" double precision not null, "gross_mass_kg" double precision not null, "rated_output_a" double precision null, "unit_price" double precision null, "notes" text null, "archived_at" timestamptz null, "created_at" timestamptz not null, constraint "anode_model_pkey" primary key ("id"));`);
    this.addSql(`alter table "anode_model" add constraint "anode_model_organisation_id_designation_unique" unique ("organisation_id", "designation");`);

    this.addSql(`create table "design" ("id" uuid not null, "organisation_id" uuid not null, "asset_id" uuid not null, "revision" int not null, "title" varchar(160) not null, "status" varchar(12) not null default 'draft', "inputs" jsonb not null, "results" jsonb null, "result_error" text null, "basis" jsonb null, "app_version" varchar(32) not null, "prepared_by_id" uuid not null, "checked_by_id" uuid null, "checked_at" timestamptz null, "approved_by_id" uuid null, "approved_at" timestamptz null, "based_on_revision" int null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "design_pkey" primary key ("id"));`);
    this.addSql(`create index "design_organisation_id_updated_at_index" on "design" ("organisation_id", "updated_at");`);
    this.addSql(`alter table "design" add constraint "design_asset_id_revision_unique" unique ("asset_id", "revision");`);

    this.addSql(`create table "zone" ("id" uuid not null, "asset_id" uuid not null, "name" varchar(80) not null, "kind" varchar(24) not null, "area_m2" double precision not null, "area_source" varchar(32) not null default 'entered', "coating_category" varchar(8) not null, "coating_age_years" double precision not null default 0, "water_type" varchar(16) not null, "climate" varchar(16) not null, "depth_band" varchar(16) not null, "temperature_c" double precision null, "drains_current" varchar(16) null, "current_density_override" jsonb null, "sort_order" int not null default 0, "archived_at" timestamptz null, "created_at" timestamptz not null, constraint "zone_pkey" primary key ("id"));`);
    this.addSql(`create index "zone_asset_id_index" on "zone" ("asset_id");`);

    this.addSql(`alter table "asset" add constraint "asset_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "anode_model" add constraint "anode_model_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "design" add constraint "design_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "design" add constraint "design_asset_id_foreign" foreign key ("asset_id") references "asset" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "design" add constraint "design_prepared_by_id_foreign" foreign key ("prepared_by_id") references "app_user" ("id") on update cascade on delete restrict;`);
    this.addSql(`alter table "design" add constraint "design_checked_by_id_foreign" foreign key ("checked_by_id") references "app_user" ("id") on update cascade on delete restrict;`);
    this.addSql(`alter table "design" add constraint "design_approved_by_id_foreign" foreign key ("approved_by_id") references "app_user" ("id") on update cascade on delete restrict;`);

    this.addSql(`alter table "zone" add constraint "zone_asset_id_foreign" foreign key ("asset_id") references "asset" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "design" drop constraint "design_asset_id_foreign";`);

    this.addSql(`alter table "zone" drop constraint "zone_asset_id_foreign";`);

    this.addSql(`drop table if exists "asset" cascade;`);

    this.addSql(`drop table if exists "anode_model" cascade;`);

    this.addSql(`drop table if exists "design" cascade;`);

    this.addSql(`drop table if exists "zone" cascade;`);
  }

}
