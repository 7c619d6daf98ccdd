import { Migration } from '@mikro-orm/migrations';

// The anode model snapshot moves out of the inputs blob into its own column, and every row says which
// version of the stored design record (lib/schemas/design-record.ts) it follows. Rows written before
// this migration are version 1; the update below makes them version 2. A row without a snapshot keeps
// a null anode_model: nothing is invented for it.
export class Migration20261202003500_design_record extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "design" add column "schema_version" int not null default 1, add column "anode_model" jsonb null;`);
    this.addSql(`update "design" set "anode_model" = nullif("inputs" -> 'anodeModelSnapshot', 'null'::jsonb), "inputs" = "inputs" - 'anodeModelSnapshot', "schema_version" = 2 where "schema_version" = 1;`);
    // New rows must say their version; the default only labelled the rows that existed.
    this.addSql(`alter table "design" alter column "schema_version" drop default;`);
  }

  override async down(): Promise<void> {
    this.addSql(`update "design" set "inputs" = "inputs" || jsonb_build_object('anodeModelSnapshot', "anode_model") where "anode_model" is not null;`);
    this.addSql(`alter table "design" drop column "schema_version", drop column "anode_model";`);
  }

}
