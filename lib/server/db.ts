import { MikroORM, type EntityManager } from '@mikro-orm/postgresql';
import { ormConfig } from '@/mikro-orm.config';
import { getEnv } from './env';

// One ORM per process, cached on globalThis so development reloads do not open new pools.
const globalForOrm = globalThis as unknown as { __tidewardenOrm?: Promise<MikroORM> };

export function getOrm(): Promise<MikroORM> {
  if (!globalForOrm.__tidewardenOrm) {
    globalForOrm.__tidewardenOrm = MikroORM.init(ormConfig(getEnv().DATABASE_URL)).catch((error) => {
      globalForOrm.__tidewardenOrm = undefined;
      throw error;
    });
  }
  return globalForOrm.__tidewardenOrm;
}

/** A fresh EntityManager for one request or action. */
export async function getEm(): Promise<EntityManager> {
  return (await getOrm()).em.fork();
}
