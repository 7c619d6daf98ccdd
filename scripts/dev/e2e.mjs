// Developer shortcut: builds and serves the app like `npm test` on ports of its own, then runs Playwright
// with the given arguments (spec files, -g filters) instead of every suite.
//   node scripts/dev/e2e.mjs tests/security/http/origin.spec.ts
// Ports: TIDEWARDEN_DEV_E2E_BASE (default 15000) + 0..5; the cluster is named by DEV_E2E_CLUSTER (default deve2e),
// so several developers can run at once on separate bases and clusters. No npm ci here.
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { root, stopAll, onShutdown, portFrom, say } from '../lib/bootstrap.mjs';
import { bringUp } from '../lib/services.mjs';

const base = portFrom('TIDEWARDEN_DEV_E2E_BASE', 15000);
const clusterName = process.env.DEV_E2E_CLUSTER || 'deve2e';
const ports = { pg: base, app: base + 1, smtp: base + 2, mailApi: base + 3, stripe: base + 4, s3: base + 5 };

async function main() {
  onShutdown(stopAll);
  const distDir = `.next-${clusterName}`;
  const { env, appUrl } = await bringUp({ mode: 'test', ports, cluster: clusterName, database: `${clusterName}_e2e`, freshDatabase: true, stateName: clusterName, distDir });
  const result = spawnSync(process.execPath, [path.join(root, 'node_modules', '@playwright', 'test', 'cli.js'), 'test', '-c', 'tests/e2e/playwright.config.ts', ...process.argv.slice(2)], {
    cwd: root,
    env: { ...env, E2E_BASE_URL: appUrl, E2E_DIST_DIR: distDir },
    stdio: 'inherit',
  });
  await stopAll();
  say(`playwright exited ${result.status}.`);
  process.exit(result.status ?? 1);
}

main().catch(async (error) => {
  process.stderr.write(`${error?.stack ?? error}\n`);
  await stopAll();
  process.exit(1);
});
