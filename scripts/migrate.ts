// Migration runner: `tsx scripts/migrate.ts up` applies pending migrations;
// `tsx scripts/migrate.ts create [name]` writes a new one from the entity/schema difference.
import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from '../mikro-orm.config';
import { getEnv } from '../lib/server/env';
import { describeStartupError } from './lib/describe-error';
import { moveStoredFilesToObjectStorage } from '../lib/server/storage/move-stored-files';
import { getStorage } from '../lib/server/storage/object-storage';

async function main() {
  const command = process.argv[2] ?? 'up';
  const url = getEnv().DATABASE_URL;
  const orm = await MikroORM.init(ormConfig(url, { discovery: { disableDynamicFileAccess: false } }));
  try {
    const migrator = orm.getMigrator();
    if (command === 'up') {
      const done = await migrator.up();
      console.log(done.length ? `Applied ${done.length} migration(s): ${done.map((m) => m.name).join(', ')}` : 'Database schema is up to date.');
      // Photos and reports still kept in PostgreSQL go to the object storage, row by row (each row commits on its
      // own, outside the migrations' transaction); a failure stops here and the next run carries on.
      const em = orm.em.fork();
      const moved = await moveStoredFilesToObjectStorage((sql, params) => em.execute(sql, params ?? []), () => getStorage());
      const total = moved.attachments + moved.attachmentBin + moved.surveyBin;
      if (total) console.log(`Moved ${total} stored file(s) into the object storage (${moved.attachments} attachments, ${moved.attachmentBin} in the attachment bin, ${moved.surveyBin} in deleted surveys).`);
    } else if (command === 'create') {
      const result = await migrator.createMigration('migrations', false, false, process.argv[3]);
      console.log(result.fileName ? `Wrote migrations/${result.fileName}; add it to migrations/index.ts.` : 'No schema changes.');
    } else if (command === 'pending') {
      const pending = await migrator.getPendingMigrations();
      console.log(pending.map((m) => m.name).join('\n') || 'none');
    } else {
      console.error(`Unknown command "${command}". Use up, create or pending.`);
      process.exitCode = 2;
    }
  } finally {
    await orm.close(true);
  }
}

main().catch((error) => {
  const cause = error instanceof Error && error.cause instanceof Error ? ` (${error.cause.name}: ${error.cause.message})` : '';
  console.error(`Migration failed: ${describeStartupError(error)}${cause}`);
  process.exit(1);
});
