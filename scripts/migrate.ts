// Migration runner: `tsx scripts/migrate.ts up` applies pending migrations;
// `tsx scripts/migrate.ts create [name]` writes a new one from the entity/schema difference.
import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from '../mikro-orm.config';
import { getEnv } from '../lib/server/env';
import { describeStartupError } from './lib/describe-error';

async function main() {
  const command = process.argv[2] ?? 'up';
  const url = getEnv().DATABASE_URL;
  const orm = await MikroORM.init(ormConfig(url, { discovery: { disableDynamicFileAccess: false } }));
  try {
    const migrator = orm.getMigrator();
    if (command === 'up') {
      const done = await migrator.up();
      console.log(done.length ? `Applied ${done.length} migration(s): ${done.map((m) => m.name).join(', ')}` : 'Database schema is up to date.');
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
  console.error(`Migration failed: ${describeStartupError(error)}`);
  process.exit(1);
});
