import { Migration } from '@mikro-orm/migrations';

// What the survey criteria need from an asset: the salinity of its water (the chloride correction of an
// Ag/AgCl/seawater electrode), anaerobic conditions and high-strength steel. Existing assets keep the old
// classification: no salinity (35 PSU in seawater), aerobic, ordinary steel.
export class Migration20261203090000_asset_survey_criteria extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "asset" add column "water_salinity_psu" double precision null, add column "anaerobic" boolean not null default false, add column "high_strength_steel" boolean not null default false;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "asset" drop column "water_salinity_psu", drop column "anaerobic", drop column "high_strength_steel";`);
  }

}
