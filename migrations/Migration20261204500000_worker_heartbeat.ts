import { Migration } from '@mikro-orm/migrations';

// The worker's heartbeat, one row per worker process, for /api/health.
export class Migration20261204500000_worker_heartbeat extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "worker_heartbeat" ("worker_id" varchar(100) not null, "host" varchar(255) not null, "pid" int not null, "started_at" timestamptz not null, "beat_at" timestamptz not null, constraint "worker_heartbeat_pkey" primary key ("worker_id"));`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "worker_heartbeat";`);
  }

}
