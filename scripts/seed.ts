// Seeds the invented demo scenario once (idempotent).
import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from '../mikro-orm.config';
import { seedDemo } from '../lib/server/demo/seed-demo';

async function main() {
  const orm = await MikroORM.init(ormConfig(process.env.DATABASE_URL!));
  try {
    const { created } = await seedDemo(orm.em.fork());
    console.log(created ? '[tidewarden] Demo scenario seeded.' : '[tidewarden] Demo scenario already present; left as it is.');
  } finally {
    await orm.close(true);
  }
}

main().catch((error) => {
  console.error(`[tidewarden] Seeding failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
