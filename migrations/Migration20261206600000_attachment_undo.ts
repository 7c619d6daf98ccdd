import { Migration } from '@mikro-orm/migrations';

// A deleted survey attachment waits a few minutes in a bin (the whole row, file included) so its delete can be undone.
export class Migration20261206600000_attachment_undo extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "survey_attachment_bin" ("id" uuid not null, "organisation_id" uuid not null, "survey_id" uuid not null, "deleted_at" timestamptz not null, "payload" jsonb not null, constraint "survey_attachment_bin_pkey" primary key ("id"));`);
    this.addSql(`create index "survey_attachment_bin_deleted_at_index" on "survey_attachment_bin" ("deleted_at");`);
    this.addSql(`alter table "survey_attachment_bin" add constraint "survey_attachment_bin_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "survey_attachment_bin" add constraint "survey_attachment_bin_survey_id_foreign" foreign key ("survey_id") references "survey" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "survey_attachment_bin";`);
  }

}
