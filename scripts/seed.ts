// Seeds the invented demo scenario once (idempotent).
import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from '../mikro-orm.config';
import { getEnv } from '../lib/server/env';
import { describeStartupError } from './lib/describe-error';
import { seedDemo } from '../lib/server/demo/seed-demo';

async function main() {
  const orm = await MikroORM.init(ormConfig(getEnv().DATABASE_URL));
  try {
    const { created } = await seedDemo(orm.em.fork());
    console.log(created ? '[tidewarden] Demo scenario seeded.' : '[tidewarden] Demo scenario already present; left as it is.');
  } finally {
    await orm.close(true);
  }
}

main().catch((error) => {
  console.error(`[tidewarden] Seeding failed: ${describeStartupError(error)}`);
  process.exit(1);
});
