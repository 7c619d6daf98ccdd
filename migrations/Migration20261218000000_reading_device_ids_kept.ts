import { Migration } from '@mikro-orm/migrations';

// A reading captured on a phone keeps its device id in `used_device_id` (as photos already do), so a phone that
// lost the answer and sends again after the reading was deleted on the desk does not bring it back. The ids of
// readings captured before this migration are copied in.
export class Migration20261218000000_reading_device_ids_kept extends Migration {

  override async up(): Promise<void> {
    this.addSql(`insert into "used_device_id" ("organisation_id", "device_id", "used_at") select "s"."organisation_id", "r"."device_id"::text, now() from "survey_reading" "r" join "survey" "s" on "s"."id" = "r"."survey_id" where "r"."device_id" is not null on conflict do nothing;`);
  }

  override async down(): Promise<void> {
    // The ids stay: forgetting them would let a deleted reading come back.
  }

}
