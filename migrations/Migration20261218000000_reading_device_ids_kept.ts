import { Migration } from '@mikro-orm/migrations';

// A reading captured on a phone keeps its device id in `used_device_id` (as photos already do), so a phone that
// lost the answer and sends again after the reading was deleted on the desk does not bring it back. The ids of
// readings captured before this migration are copied in, from the readings and from the audit log (readings
// deleted since).
export class Migration20261218000000_reading_device_ids_kept extends Migration {

  override async up(): Promise<void> {
    this.addSql(`insert into "used_device_id" ("organisation_id", "device_id", "used_at") select "s"."organisation_id", "r"."device_id"::text, now() from "survey_reading" "r" join "survey" "s" on "s"."id" = "r"."survey_id" where "r"."device_id" is not null on conflict do nothing;`);
    // And those of readings captured and deleted since (or in surveys deleted since): their audit rows keep the id.
    this.addSql(`insert into "used_device_id" ("organisation_id", "device_id", "used_at") select "a"."organisation_id", "a"."details"->>'deviceId', now() from "audit_event" "a" where "a"."action" = 'survey.reading-added' and "a"."organisation_id" is not null and "a"."details"->>'deviceId' ~* '^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$' and exists (select 1 from "organisation" "o" where "o"."id" = "a"."organisation_id") on conflict do nothing;`);
  }

  override async down(): Promise<void> {
    // The ids stay: forgetting them would let a deleted reading come back.
  }

}
