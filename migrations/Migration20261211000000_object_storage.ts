import { Migration } from '@mikro-orm/migrations';
import { moveStoredFilesToObjectStorage } from '../lib/server/storage/move-stored-files';
import { getStorage } from '../lib/server/storage/object-storage';

// Survey photos and reports move out of PostgreSQL into the object storage (S3_* settings; the local fake is
// started before the migration). The bytes of every live attachment, of every deleted one waiting for its undo
// (survey_attachment_bin) and of every deleted survey's attachments (survey_bin) are written under their key
// first and only then taken out of the row; `data` is then dropped. Each step can run again: the keys are fixed
// by the attachment ids, and the schema changes say "if (not) exists".
// Uploads from the browser go straight to the storage: survey_attachment_upload holds each one until it is
// completed, and device_id makes one device item one attachment, per organisation, for good.
export class Migration20261211000000_object_storage extends Migration {

  override async up(): Promise<void> {
    await this.execute(`alter table "survey_attachment" add column if not exists "object_key" varchar(300) null, add column if not exists "device_id" varchar(64) null;`);
    await this.execute(`do $$ begin
      if exists (select 1 from information_schema.columns where table_schema = current_schema() and table_name = 'survey_attachment' and column_name = 'data') then
        alter table "survey_attachment" alter column "data" drop not null;
      end if;
    end $$;`);
    await this.execute(`create table if not exists "survey_attachment_upload" ("id" uuid not null, "organisation_id" uuid not null, "survey_id" uuid not null, "device_id" varchar(64) not null, "object_key" varchar(300) not null, "filename" varchar(200) not null, "content_type" varchar(60) not null, "size_bytes" int not null, "caption" varchar(200) null, "uploaded_by_email" varchar(254) null, "created_at" timestamptz not null, constraint "survey_attachment_upload_pkey" primary key ("id"), constraint "survey_attachment_upload_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade, constraint "survey_attachment_upload_survey_id_foreign" foreign key ("survey_id") references "survey" ("id") on update cascade on delete cascade);`);
    await this.execute(`create unique index if not exists "survey_attachment_upload_organisation_id_device_id_unique" on "survey_attachment_upload" ("organisation_id", "device_id");`);
    await this.execute(`create unique index if not exists "survey_attachment_upload_object_key_unique" on "survey_attachment_upload" ("object_key");`);
    await this.execute(`create index if not exists "survey_attachment_upload_survey_id_index" on "survey_attachment_upload" ("survey_id");`);
    await this.execute(`create index if not exists "survey_attachment_upload_created_at_index" on "survey_attachment_upload" ("created_at");`);

    await moveStoredFilesToObjectStorage((sql, params) => this.execute(sql, params), () => getStorage());

    await this.execute(`alter table "survey_attachment" drop column if exists "data";`);
    await this.execute(`alter table "survey_attachment" alter column "object_key" set not null;`);
    await this.execute(`create unique index if not exists "survey_attachment_object_key_unique" on "survey_attachment" ("object_key");`);
    await this.execute(`create unique index if not exists "survey_attachment_organisation_id_device_id_unique" on "survey_attachment" ("organisation_id", "device_id");`);
    // The storage clean-up job asks, for each listed object, whether a deleted survey still holds it.
    await this.execute(`create index if not exists "survey_bin_attachment_keys_index" on "survey_bin" using gin ((payload->'attachments') jsonb_path_ops);`);
  }

  override async down(): Promise<void> {
    // The files stay in the object storage; bringing them back into PostgreSQL is not automatic.
    this.addSql(`drop table if exists "survey_attachment_upload";`);
    this.addSql(`drop index if exists "survey_bin_attachment_keys_index";`);
    this.addSql(`alter table "survey_attachment" add column if not exists "data" bytea null;`);
    this.addSql(`alter table "survey_attachment" drop column if exists "device_id";`);
  }

}
