import { defineConfig, type Options } from '@mikro-orm/postgresql';
import { Migrator } from '@mikro-orm/migrations';
import { allEntities } from './entities';
import { migrationsList } from './migrations';

// One configuration for the app, the scripts and the tests. Entities and migrations are listed
// explicitly because folder discovery does not survive the Next.js bundler.
export function ormConfig(clientUrl: string, overrides: Partial<Options> = {}): Options {
  return defineConfig({
    clientUrl,
    entities: allEntities,
    discovery: { disableDynamicFileAccess: true },
    // Run onCreate hooks in em.create(), so a new entity's UUID is known before the flush (audit rows use it).
    processOnCreateHooksEarly: true,
    extensions: [Migrator],
    migrations: {
      migrationsList,
      path: 'migrations',
      pathTs: 'migrations',
      tableName: 'mikro_orm_migrations',
      transactional: true,
      allOrNothing: true,
      emit: 'ts',
      snapshot: false,
    },
    pool: { min: 0, max: 10 },
    debug: false,
    ...overrides,
  });
}

export default ormConfig(process.env.DATABASE_URL ?? 'postgres://127.0.0.1:5432/tidewarden');
