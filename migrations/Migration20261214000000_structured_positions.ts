import { Migration } from '@mikro-orm/migrations';
import { parsePositionV1 } from './frozen/parse-position-v1';

// Anode positions as data (anode_group.position, jsonb: frames, side, height above keel and part of the hull, or
// piles by bent and row and depth below a datum, with what could not be read kept as the note), parsed from the
// free text each group already has; and the particulars the drawings need (frame spacing, pile rows and bents,
// each with where it comes from: 'entered' or 'estimate'). The parser is frozen at its first version (a migration
// gives the same result on every install); the rows carry no parser version, so positionOf reads them again with
// the parser of the day. Idempotent: the columns are added if missing and only
// groups without a parsed position are parsed, so a second run changes nothing.
export class Migration20261214000000_structured_positions extends Migration {

  override async up(): Promise<void> {
    // Run in order within the migration's transaction (addSql would run only after up() returns).
    await this.execute(`alter table "anode_group" add column if not exists "position" jsonb null;`);
    await this.execute(`alter table "asset" add column if not exists "frame_spacing_m" double precision null, add column if not exists "frame_spacing_source" varchar(16) null, add column if not exists "pile_rows" int null, add column if not exists "pile_bents" int null, add column if not exists "pile_grid_source" varchar(16) null;`);
    for (;;) {
      const rows = (await this.execute(`select "id", "positions" from "anode_group" where "position" is null and "positions" is not null and btrim("positions") <> '' order by "id" limit 500;`)) as { id: string; positions: string }[];
      if (!rows.length) break;
      const parsed = rows.map((r) => ({ id: r.id, pos: parsePositionV1(r.positions) }));
      await this.execute(
        `update "anode_group" g set "position" = v.pos from jsonb_to_recordset(?::jsonb) as v(id uuid, pos jsonb) where g."id" = v.id and g."position" is null;`,
        [JSON.stringify(parsed)],
      );
    }
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "anode_group" drop column if exists "position";`);
    this.addSql(`alter table "asset" drop column if exists "frame_spacing_m", drop column if exists "frame_spacing_source", drop column if exists "pile_rows", drop column if exists "pile_bents", drop column if exists "pile_grid_source";`);
  }

}
