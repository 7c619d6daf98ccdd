import { Migration } from '@mikro-orm/migrations';

// Readings captured on a phone carry the UUID the phone gave them (`device_id`): the capture route records
// each one once per survey however often the phone sends it, and a repeat is answered with the reading it
// made, for as long as the reading exists (idempotency keys are forgotten after 48 hours; this is not).
export class Migration20261212000000_capture_device_id extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "survey_reading" add column "device_id" uuid null;`);
    this.addSql(`create unique index "survey_reading_survey_id_device_id_unique" on "survey_reading" ("survey_id", "device_id") where "device_id" is not null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop index if exists "survey_reading_survey_id_device_id_unique";`);
    this.addSql(`alter table "survey_reading" drop column if exists "device_id";`);
  }

}
