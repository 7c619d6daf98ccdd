import { Migration } from '@mikro-orm/migrations';

// Each stored position carries the version of the parser that wrote it (anode_group.position_parser_version,
// lib/drawings/parse-position.ts PARSER_VERSION). Rows written before have none: positionOf reads their text
// again with the parser of the day, so a fix to the parser reaches them and the page, the PDFs and the CSVs say
// the same. Values the first migration stored outside what anodePositionSchema allows (a frame past 2000, a height
// past 60 m, a depth past 300 m, a bent past 999) are moved out: the field set to null and the text, as written,
// put in the note. Nothing here runs the parser. Idempotent.
const OUT: [string[], string][] = [
  [['frameFrom', 'frameTo'], `(("position"->>'frameFrom')::numeric not between -50 and 2000 or ("position"->>'frameTo')::numeric not between -50 and 2000)`],
  [['heightAboveKeelM'], `("position"->>'heightAboveKeelM')::numeric not between 0 and 60`],
  [['depthBelowDatumM', 'datum'], `("position"->>'depthBelowDatumM')::numeric not between -30 and 300`],
  [['pileFrom', 'pileTo'], `(("position"->'pileFrom'->>'bent')::numeric not between 1 and 999 or ("position"->'pileTo'->>'bent')::numeric not between 1 and 999)`],
];

export class Migration20261216000000_position_parser_version extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "anode_group" add column if not exists "position_parser_version" int null;`);
    for (const [fields, outside] of OUT) {
      const nulls = fields.map((f) => `'${f}', null`).join(', ');
      this.addSql(`update "anode_group" set "position" = "position" || jsonb_build_object(${nulls}, 'note', left(regexp_replace(btrim("positions"), '\\s+', ' ', 'g'), 2000)) where "position" is not null and "positions" is not null and ${outside};`);
    }
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "anode_group" drop column if exists "position_parser_version";`);
  }

}
