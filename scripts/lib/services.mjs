// The stack both commands bring up: database, migrations, seed, fakes, app. Plain Node.
import fs from 'node:fs';
import path from 'node:path';
import { root, say, startCluster, runTs, startSupervisedTsChild, waitForPort, requireFreePort, buildIfStale, startNext } from './bootstrap.mjs';

export function demoSignIns() {
  return JSON.parse(fs.readFileSync(path.join(root, 'scripts', 'demo-sign-ins.json'), 'utf8'));
}

/**
 * @param {{ mode: 'development'|'test', ports: { app:number, pg:number, smtp:number, mailApi:number, stripe:number, s3:number },
 *           cluster: string, database: string, freshDatabase: boolean, distDir: string, stateName?: string,
 *           portVariables?: { app?: string, smtp?: string, mailApi?: string, stripe?: string, s3?: string } }} options
 */
/**
 * What the app and the fakes need to find each other on loopback: the SMTP fake and its inbox API,
 * the Stripe fake (API, pages, webhooks to the app), the object-storage fake (its bucket, keys and the folder
 * its objects live in) and the local keys. Shared by npm start, npm test and the developer shortcut scripts/dev/vitest.mjs.
 * @param {{ ports: { smtp:number, mailApi:number, stripe:number, s3:number }, appUrl: string, stateName: string }} options
 */
export function fakesEnv({ ports, appUrl, stateName }) {
  return {
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(ports.smtp),
    FAKE_SMTP_PORT: String(ports.smtp),
    FAKE_MAIL_API_PORT: String(ports.mailApi),
    FAKE_MAIL_API: `http://127.0.0.1:${ports.mailApi}`,
    FAKE_STRIPE_PORT: String(ports.stripe),
    FAKE_STRIPE_WEBHOOK_URL: `${appUrl}/api/webhooks/stripe`,
    FAKE_STRIPE_PUBLIC_URL: `http://127.0.0.1:${ports.stripe}`,
    FAKE_STRIPE_STATE_FILE: path.join(root, '.data', `stripe-${stateName}.json`),
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(ports.stripe),
    STRIPE_API_PROTOCOL: 'http',
    STRIPE_SECRET_KEY: 'sk_test_tidewarden_local',
    STRIPE_WEBHOOK_SECRET: process.env.STRIPE_WEBHOOK_SECRET || 'whsec_tidewarden_local',
    FAKE_S3_PORT: String(ports.s3),
    FAKE_S3_DATA_DIR: path.join(root, '.data', `s3-${stateName}`),
    // The bucket's CORS rule: the app's pages upload to and read from the storage directly.
    FAKE_S3_CORS_ORIGINS: appUrl,
    S3_ENDPOINT: `http://127.0.0.1:${ports.s3}`,
    S3_BUCKET: 'tidewarden-local',
    S3_ACCESS_KEY_ID: 'tidewarden-local',
    S3_SECRET_ACCESS_KEY: 'tidewarden-local-secret',
    S3_REGION: 'us-east-1',
    S3_FORCE_PATH_STYLE: 'true',
  };
}

export async function bringUp(options) {
  const { ports } = options;
  // The variables that choose each port, named when one is taken (the bench has its own).
  const variables = { app: options.mode === 'test' ? 'TIDEWARDEN_TEST_PORT' : 'PORT', smtp: 'FAKE_SMTP_PORT', mailApi: 'FAKE_MAIL_API_PORT', stripe: 'FAKE_STRIPE_PORT', s3: 'FAKE_S3_PORT', ...options.portVariables };
  await requireFreePort(ports.app, 'the web app', variables.app);
  await requireFreePort(ports.smtp, 'the SMTP fake', variables.smtp);
  await requireFreePort(ports.mailApi, 'the SMTP fake inbox', variables.mailApi);
  await requireFreePort(ports.stripe, 'the Stripe fake', variables.stripe);
  await requireFreePort(ports.s3, 'the object-storage fake', variables.s3);

  let databaseUrl = options.mode === 'development' ? process.env.DATABASE_URL : undefined;
  let cluster = null;
  if (databaseUrl) {
    say('DATABASE_URL is set: using that PostgreSQL, no local cluster.');
  } else {
    cluster = await startCluster({ name: options.cluster, port: ports.pg });
    await cluster.ensureDatabase(options.database, { fresh: options.freshDatabase });
    databaseUrl = cluster.urlFor(options.database);
  }

  const appUrl = `http://127.0.0.1:${ports.app}`;
  const env = {
    ...process.env,
    TIDEWARDEN_ENV: options.mode,
    DATABASE_URL: databaseUrl,
    APP_URL: process.env.APP_URL && options.mode === 'development' ? process.env.APP_URL : appUrl,
    ...fakesEnv({ ports, appUrl, stateName: options.stateName ?? options.mode }),
    NEXT_TELEMETRY_DISABLED: '1',
  };
  // Pages served under a public APP_URL of their own upload to the storage too.
  env.FAKE_S3_CORS_ORIGINS = [...new Set([appUrl, env.APP_URL])].join(',');
  // The fakes start first: the seed sets up the demo subscription through the Stripe fake, and the migration
  // moves stored files into the object storage.
  // A fresh database starts with an empty storage too (the objects belong to the rows).
  if (options.freshDatabase) {
    fs.rmSync(env.FAKE_STRIPE_STATE_FILE, { force: true });
    fs.rmSync(env.FAKE_S3_DATA_DIR, { recursive: true, force: true });
  }
  // The fakes and the worker are supervised: if one dies it is started again with back-off (a line in the log).
  const smtp = startSupervisedTsChild('fake-smtp', 'The SMTP fake', 'fakes/smtp/server.ts', env);
  const stripe = startSupervisedTsChild('fake-stripe', 'The Stripe fake', 'fakes/stripe/server.ts', env);
  await waitForPort(ports.mailApi, 'The SMTP fake', 30_000, smtp.child);
  const s3 = startSupervisedTsChild('fake-s3', 'The object-storage fake', 'fakes/s3/server.ts', env);
  await waitForPort(ports.stripe, 'The Stripe fake', 30_000, stripe.child);
  // Before the migration: it moves files that were kept in PostgreSQL into the storage.
  await waitForPort(ports.s3, 'The object-storage fake', 30_000, s3.child);

  say('Migrating the database...');
  runTs('scripts/migrate.ts', ['up'], env, 'The database migration failed; see the message above.');
  runTs('scripts/seed.ts', [], env, 'Seeding the demo scenario failed; see the message above.');

  startSupervisedTsChild('worker', 'The worker', 'scripts/worker.ts', env);

  buildIfStale(options.distDir, env);
  const next = startNext(options.distDir, ports.app, env);
  await waitForPort(ports.app, 'The web app', 60_000, next);
  return { env, appUrl, cluster };
}
