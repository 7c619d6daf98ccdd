import { Migration } from '@mikro-orm/migrations';

// Survey photos and reports move out of PostgreSQL into the object storage. This migration changes the schema
// only (quick, inside the migrator's one transaction): survey_attachment gets object_key and device_id, data
// becomes nullable and stays until its bytes are moved. The bytes are moved afterwards, outside any migration
// transaction, by moveStoredFilesToObjectStorage (lib/server/storage/move-stored-files.ts), which
// `tsx scripts/migrate.ts up` runs after the migrations and the worker runs at start: it commits row by row, so a
// crash or a storage outage half-way loses nothing and the next run carries on. A row whose bytes have been moved
// has its object_key and data NULL; the storage clean-up job does nothing while any row still has bytes.
// Uploads from the browser go straight to the storage: survey_attachment_upload holds each one until it is
// completed, and used_device_id keeps every device item id ever recorded, so one device item becomes one
// attachment per organisation for good (a late retry after a delete does not bring it back).
export class Migration20261211000000_object_storage extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "survey_attachment" add column if not exists "object_key" varchar(300) null, add column if not exists "device_id" varchar(64) null;`);
    this.addSql(`alter table "survey_attachment" alter column "data" drop not null;`);
    this.addSql(`create table if not exists "survey_attachment_upload" ("id" uuid not null, "organisation_id" uuid not null, "survey_id" uuid not null, "device_id" varchar(64) not null, "object_key" varchar(300) not null, "filename" varchar(200) not null, "content_type" varchar(60) not null, "size_bytes" int not null, "caption" varchar(200) null, "uploaded_by_email" varchar(254) null, "created_at" timestamptz not null, constraint "survey_attachment_upload_pkey" primary key ("id"), constraint "survey_attachment_upload_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade, constraint "survey_attachment_upload_survey_id_foreign" foreign key ("survey_id") references "survey" ("id") on update cascade on delete cascade);`);
    this.addSql(`create unique index if not exists "survey_attachment_upload_organisation_id_device_id_unique" on "survey_attachment_upload" ("organisation_id", "device_id");`);
    this.addSql(`create unique index if not exists "survey_attachment_upload_object_key_unique" on "survey_attachment_upload" ("object_key");`);
    this.addSql(`create index if not exists "survey_attachment_upload_survey_id_index" on "survey_attachment_upload" ("survey_id");`);
    this.addSql(`create index if not exists "survey_attachment_upload_created_at_index" on "survey_attachment_upload" ("created_at");`);
    this.addSql(`create index if not exists "survey_attachment_upload_member_index" on "survey_attachment_upload" ("organisation_id", "uploaded_by_email");`);
    this.addSql(`create table if not exists "used_device_id" ("organisation_id" uuid not null, "device_id" varchar(64) not null, "used_at" timestamptz not null, constraint "used_device_id_pkey" primary key ("organisation_id", "device_id"), constraint "used_device_id_organisation_id_foreign" foreign key ("organisation_id") references "organisation" ("id") on update cascade on delete cascade);`);
    this.addSql(`create unique index if not exists "survey_attachment_object_key_unique" on "survey_attachment" ("object_key");`);
    this.addSql(`create unique index if not exists "survey_attachment_organisation_id_device_id_unique" on "survey_attachment" ("organisation_id", "device_id");`);
    // The storage clean-up job asks, for each listed object, whether a deleted survey still holds it.
    this.addSql(`create index if not exists "survey_bin_attachment_keys_index" on "survey_bin" using gin ((payload->'attachments') jsonb_path_ops);`);
  }

  override async down(): Promise<void> {
    // The bytes of moved files are in the object storage only; no schema the earlier version runs on can hold them.
    throw new Error('Migration20261211000000_object_storage is irreversible: the photos and reports now live in the object storage. Restore a backup of the database and the bucket instead.');
  }

}
