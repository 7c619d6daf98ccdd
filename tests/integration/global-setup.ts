import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from '../../mikro-orm.config';

const LOCAL_HOSTS = new Set(['127.0.0.1', 'localhost', '::1', '[::1]']);

// Creates the integration database afresh for every run and migrates it. Refuses any non-local host,
// so a mistyped DATABASE_URL can never wipe a real database.
export default async function setup() {
  const url = process.env.TIDEWARDEN_IT_DATABASE_URL;
  if (!url) throw new Error('TIDEWARDEN_IT_DATABASE_URL is not set; run the integration tests through `npm test`.');
  const parsed = new URL(url);
  if (!LOCAL_HOSTS.has(parsed.hostname)) throw new Error(`Refusing to run integration tests against ${parsed.hostname}: only a local PostgreSQL is allowed.`);
  const database = parsed.pathname.replace(/^\//, '');
  if (!/^[a-z0-9_]+_it$/.test(database)) throw new Error(`Refusing to recreate "${database}": the integration database name must end in _it.`);
  process.env.DATABASE_URL = url;

  const adminUrl = new URL(url);
  adminUrl.pathname = '/postgres';
  const admin = await MikroORM.init(ormConfig(adminUrl.toString()));
  await admin.em.getConnection().execute(`drop database if exists "${database}" with (force)`);
  await admin.em.getConnection().execute(`create database "${database}"`);
  await admin.close(true);

  // The tests' bucket in the object-storage fake (npm test gives them one of their own).
  const { ObjectStorage } = await import('../../lib/server/storage/object-storage');
  const { parseEnv } = await import('../../lib/server/env');
  await new ObjectStorage(parseEnv(process.env)).ensureBucket();

  const orm = await MikroORM.init(ormConfig(url));
  await orm.getMigrator().up();
  await orm.close(true);
}
