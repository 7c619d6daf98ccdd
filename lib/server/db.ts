import { MikroORM, type EntityManager } from '@mikro-orm/postgresql';
import { ormConfig } from '@/mikro-orm.config';
import { getEnv } from './env';

// One ORM per process, cached on globalThis so development reloads do not open new pools.
const globalForOrm = globalThis as unknown as { __tidewardenOrm?: Promise<MikroORM> };

/** Under vitest, every SQL statement is counted, so tests can prove a request's statement count does not grow with the data. */
export const queryCounter = { count: 0 };
const countingOptions = process.env.VITEST
  ? {
      debug: ['query' as const],
      logger: (message: string) => {
        if (message.includes('[query]')) queryCounter.count++;
      },
    }
  : {};

export function getOrm(): Promise<MikroORM> {
  if (!globalForOrm.__tidewardenOrm) {
    globalForOrm.__tidewardenOrm = MikroORM.init(ormConfig(getEnv().DATABASE_URL, countingOptions)).catch((error) => {
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
