// `npm test`: the same set-up as `npm start` on its own ports and databases, then every suite:
// unit and integration (vitest, real PostgreSQL), end-to-end (@playwright/test in Debian's Chromium).
// Ends with one line "N passed, N failed".
import fs from 'node:fs';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { root, ensureNodeModules, aptInstall, say, stopAll, onShutdown, portFrom, BootstrapError } from './lib/bootstrap.mjs';
import { bringUp } from './lib/services.mjs';

const resultsDir = path.join(root, '.data', 'test-results');

function runSuite(name, command, args, env) {
  say(`Running the ${name} tests...`);
  const started = Date.now();
  const result = spawnSync(command, args, { cwd: root, env, stdio: 'inherit' });
  say(`${name} tests finished in ${Math.round((Date.now() - started) / 1000)} s (exit ${result.status}).`);
  return result.status ?? 1;
}

function readJson(file) {
  try {
    return JSON.parse(fs.readFileSync(file, 'utf8'));
  } catch {
    return null;
  }
}

async function main() {
  const started = Date.now();
  ensureNodeModules();
  if (!fs.existsSync('/usr/bin/chromium')) aptInstall(['chromium'], "Debian's Chromium (for the end-to-end tests)");
  onShutdown(stopAll);
  fs.rmSync(resultsDir, { recursive: true, force: true });
  fs.mkdirSync(resultsDir, { recursive: true });

  const ports = {
    app: portFrom('TIDEWARDEN_TEST_PORT', 3100),
    pg: portFrom('TIDEWARDEN_TEST_PG_PORT', 54339),
    smtp: portFrom('TIDEWARDEN_TEST_SMTP_PORT', 2625),
    mailApi: portFrom('TIDEWARDEN_TEST_MAIL_API_PORT', 2626),
    stripe: portFrom('TIDEWARDEN_TEST_STRIPE_PORT', 12211),
    s3: portFrom('TIDEWARDEN_TEST_S3_PORT', 12221),
  };
  const distDir = '.next-test';
  const { env, appUrl, cluster } = await bringUp({ mode: 'test', ports, cluster: 'test', database: 'tidewarden_e2e', freshDatabase: true, distDir, portVariables: { s3: 'TIDEWARDEN_TEST_S3_PORT' } });

  const counts = { passed: 0, failed: 0, skipped: 0 };
  const vitestJson = path.join(resultsDir, 'vitest.json');
  const vitestEnv = {
    ...env,
    DATABASE_URL: cluster.urlFor('tidewarden_it'),
    TIDEWARDEN_IT_DATABASE_URL: cluster.urlFor('tidewarden_it'),
    // A bucket of their own (made by their global set-up), so the storage clean-up tests never see the served app's files.
    S3_BUCKET: 'tidewarden-it',
    E2E_BASE_URL: appUrl,
  };
  const vitestExit = runSuite('unit and integration', process.execPath, [path.join(root, 'node_modules', 'vitest', 'vitest.mjs'), 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${vitestJson}`], vitestEnv);
  const vitest = readJson(vitestJson);
  if (vitest) {
    counts.passed += vitest.numPassedTests;
    counts.failed += vitest.numFailedTests + (vitest.numRuntimeErrorTestSuites ?? 0);
    counts.skipped += (vitest.numPendingTests ?? 0) + (vitest.numTodoTests ?? 0);
    if (vitestExit !== 0 && vitest.numFailedTests === 0) counts.failed += 1; // a crash outside any test
  } else {
    say('The vitest run produced no report; counting it as one failure.');
    counts.failed += 1;
  }

  const playwrightJson = path.join(resultsDir, 'playwright.json');
  const e2eExit = runSuite('end-to-end', process.execPath, [path.join(root, 'node_modules', '@playwright', 'test', 'cli.js'), 'test', '-c', 'tests/e2e/playwright.config.ts'], {
    ...env,
    E2E_BASE_URL: appUrl,
    // The build the app is served from: tests/e2e/two-instances.spec.ts starts a second instance of it.
    E2E_DIST_DIR: distDir,
    PLAYWRIGHT_JSON_OUTPUT_NAME: playwrightJson,
  });
  const playwright = readJson(playwrightJson);
  if (playwright?.stats) {
    counts.passed += playwright.stats.expected + (playwright.stats.flaky ?? 0);
    counts.failed += playwright.stats.unexpected;
    counts.skipped += playwright.stats.skipped ?? 0;
    if (e2eExit !== 0 && playwright.stats.unexpected === 0) counts.failed += 1;
  } else {
    say('The Playwright run produced no report; counting it as one failure.');
    counts.failed += 1;
  }

  await stopAll();
  say(`All suites finished in ${Math.round((Date.now() - started) / 1000)} s.`);
  const skipped = counts.skipped ? `, ${counts.skipped} skipped` : '';
  process.stdout.write(`${counts.passed} passed, ${counts.failed} failed${skipped}\n`);
  process.exit(counts.failed ? 1 : 0);
}

main().catch(async (error) => {
  const message = error instanceof BootstrapError ? error.message : `Test set-up failed: ${error?.stack ?? error}`;
  process.stderr.write(`[tidewarden] ${message}\n`);
  await stopAll();
  process.stdout.write('0 passed, 1 failed\n');
  process.exit(1);
});
