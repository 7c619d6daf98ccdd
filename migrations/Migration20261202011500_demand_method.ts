import { Migration } from '@mikro-orm/migrations';

// Design record version 3 (lib/schemas/design-record.ts). The inputs now name the method the current
// demand was found by; rows written before were all sized with the offshore-structure table, so they
// keep it, explicitly, with the resistivity and protective potential as they were entered. Results
// carry the one count to fit: the zone shares rounded up, never below the criteria's count.
// The catalogue can state the resistivity a data-sheet output was measured at.
export class Migration20261202011500_demand_method extends Migration {

  override async up(): Promise<void> {
    this.addSql(`update "design" set "inputs" = "inputs" || '{"demandMethod":"offshore-table","hullCoatingCondition":"good","serviceSpeedKnots":null,"salinityPsu":null,"resistivitySource":"measured","potentialSource":"entered"}'::jsonb, "schema_version" = 3 where "schema_version" = 2;`);
    this.addSql(`update "design" set "results" = "results" || jsonb_build_object('anodesToFit', greatest(("results" ->> 'anodeCount')::int, case when jsonb_typeof("results" -> 'distribution' -> 'distributedCount') = 'number' then ("results" -> 'distribution' ->> 'distributedCount')::int else 0 end)) where jsonb_typeof("results" -> 'anodeCount') = 'number' and ("results" -> 'anodesToFit') is null;`);
    this.addSql(`alter table "anode_model" add column "rated_at_resistivity_ohm_m" double precision null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "anode_model" drop column "rated_at_resistivity_ohm_m";`);
    this.addSql(`update "design" set "results" = "results" - 'anodesToFit' where "results" is not null;`);
    this.addSql(`update "design" set "inputs" = "inputs" - 'demandMethod' - 'hullCoatingCondition' - 'serviceSpeedKnots' - 'salinityPsu' - 'resistivitySource' - 'potentialSource', "schema_version" = 2 where "schema_version" = 3;`);
  }

}
