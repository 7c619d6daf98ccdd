// Developer shortcut: runs vitest (unit and integration) with its arguments against a local PostgreSQL
// cluster and the three fakes (SMTP, Stripe, object storage) on ports of their own, without building or starting the app.
//   node scripts/dev/vitest.mjs tests/integration/register.test.ts
// Ports: TIDEWARDEN_DEV_IT_BASE (default 14000) + 0..4; the cluster is named by DEV_IT_CLUSTER (default devit),
// so several developers can run at once on separate bases and clusters.
import fs from 'node:fs';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { fakesEnv } from '../lib/services.mjs';
import { root, startCluster, startTsChild, waitForPort, stopAll, onShutdown, portFrom, say } from '../lib/bootstrap.mjs';

const base = portFrom('TIDEWARDEN_DEV_IT_BASE', 14000);
const clusterName = process.env.DEV_IT_CLUSTER || 'devit';
const ports = { pg: base, smtp: base + 1, mailApi: base + 2, stripe: base + 3, s3: base + 4 };

async function main() {
  // No npm ci here: a worktree whose node_modules links to another checkout would empty that one.
  onShutdown(stopAll);
  const cluster = await startCluster({ name: clusterName, port: ports.pg });
  const database = `${clusterName}_it`;
  const env = {
    ...process.env,
    TIDEWARDEN_ENV: 'test',
    DATABASE_URL: cluster.urlFor(database),
    TIDEWARDEN_IT_DATABASE_URL: cluster.urlFor(database),
    APP_URL: 'http://127.0.0.1:1',
    // No app runs here: webhooks from the Stripe fake go nowhere, as the tests expect.
    ...fakesEnv({ ports, appUrl: 'http://127.0.0.1:1', stateName: clusterName }),
    STRIPE_WEBHOOK_SECRET: 'whsec_tidewarden_local',
  };
  const smtp = startTsChild('fake-smtp', 'fakes/smtp/server.ts', env, { quiet: true });
  const stripe = startTsChild('fake-stripe', 'fakes/stripe/server.ts', env, { quiet: true });
  // Each run starts with an empty storage, as with the fresh integration database.
  fs.rmSync(env.FAKE_S3_DATA_DIR, { recursive: true, force: true });
  const s3 = startTsChild('fake-s3', 'fakes/s3/server.ts', env, { quiet: true });
  await waitForPort(ports.mailApi, 'The SMTP fake', 30_000, smtp);
  await waitForPort(ports.stripe, 'The Stripe fake', 30_000, stripe);
  await waitForPort(ports.s3, 'The object-storage fake', 30_000, s3);
  const result = spawnSync(process.execPath, [path.join(root, 'node_modules', 'vitest', 'vitest.mjs'), 'run', ...process.argv.slice(2)], { cwd: root, env, stdio: 'inherit' });
  await stopAll();
  say(`vitest exited ${result.status}.`);
  process.exit(result.status ?? 1);
}

main().catch(async (error) => {
  process.stderr.write(`${error?.stack ?? error}\n`);
  await stopAll();
  process.exit(1);
});
