// `npm run bench`: measures the performance targets on this machine, in two stages.
//  - In process: starts its own PostgreSQL cluster ("bench", port TIDEWARDEN_BENCH_PG_PORT, default 54349),
//    migrates a fresh `tidewarden_bench` database and runs scripts/bench.ts against it.
//  - HTTP (scripts/bench-http.mjs): builds the production app into .next-bench when stale, brings it up like
//    `npm test` does (lib/services.mjs bringUp: a fresh `tidewarden_bench_http` database in the same cluster,
//    migrated and seeded with the demo scenario, the SMTP, Stripe and object-storage fakes, the worker, `next start`) on ports
//    of its own (TIDEWARDEN_BENCH_PORT 3200, TIDEWARDEN_BENCH_SMTP_PORT 2725, TIDEWARDEN_BENCH_MAIL_API_PORT 2726,
//    TIDEWARDEN_BENCH_STRIPE_PORT 12311, TIDEWARDEN_BENCH_S3_PORT 12321), and measures it over HTTP. The worker runs as in a deployment: the
//    app's /api/health, the reference of every ratio, answers 503 without its heartbeat.
// TIDEWARDEN_BENCH_ONLY (a comma list of design, forecast, pdf, database, http) picks benchmarks; `http` alone
// skips the in-process stage, and without `http` the app is not built or started.
// Everything started is stopped again at the end, on a failure and on Ctrl-C. Exit code 0 when the benchmarks
// ran (over target or not), 1 when one crashed or an HTTP row FAILED.
import { BootstrapError, ensureNodeModules, onShutdown, portFrom, runTs, say, startCluster, stopAll } from './lib/bootstrap.mjs';

const IN_PROCESS = ['design', 'forecast', 'pdf', 'database'];

function stages() {
  const only = (process.env.TIDEWARDEN_BENCH_ONLY ?? '').split(',').map((x) => x.trim()).filter(Boolean);
  const unknown = only.filter((name) => name !== 'http' && !IN_PROCESS.includes(name));
  if (unknown.length) throw new BootstrapError(`TIDEWARDEN_BENCH_ONLY names no benchmark "${unknown.join('", "')}"; use ${[...IN_PROCESS, 'http'].join(', ')}.`);
  return { inProcess: only.length === 0 || only.some((name) => IN_PROCESS.includes(name)), http: only.length === 0 || only.includes('http') };
}

async function inProcessStage(pgPort) {
  const cluster = await startCluster({ name: 'bench', port: pgPort });
  await cluster.ensureDatabase('tidewarden_bench', { fresh: true });
  const env = {
    ...process.env,
    DATABASE_URL: cluster.urlFor('tidewarden_bench'),
    TIDEWARDEN_ENV: 'test',
    // Nothing here sends mail; port 1 makes sure nothing could.
    SMTP_PORT: '1',
    // React and the libraries as `next start` runs them (development React is slower).
    NODE_ENV: 'production',
    // Lets the benchmarks collect garbage between measurements, outside the timed runs.
    NODE_OPTIONS: [process.env.NODE_OPTIONS, '--expose-gc'].filter(Boolean).join(' '),
  };
  say('Migrating the bench database...');
  runTs('scripts/migrate.ts', ['up'], env, 'The migration of the bench database failed; see the message above.');
  say('Running the benchmarks (about a minute)...');
  runTs('scripts/bench.ts', [], env, 'The benchmarks stopped early (a crash, or Ctrl-C); see the message above.');
}

async function httpStage(pgPort) {
  // Imported here so that the in-process benchmarks alone need nothing more than before.
  const { bringUp } = await import('./lib/services.mjs');
  const { runHttpBench, httpSeconds } = await import('./bench-http.mjs');
  httpSeconds(); // a wrong value is reported before the build, not after it
  const ports = {
    app: portFrom('TIDEWARDEN_BENCH_PORT', 3200),
    pg: pgPort,
    smtp: portFrom('TIDEWARDEN_BENCH_SMTP_PORT', 2725),
    mailApi: portFrom('TIDEWARDEN_BENCH_MAIL_API_PORT', 2726),
    stripe: portFrom('TIDEWARDEN_BENCH_STRIPE_PORT', 12311),
    s3: portFrom('TIDEWARDEN_BENCH_S3_PORT', 12321),
  };
  const distDir = '.next-bench';
  const { env, appUrl } = await bringUp({
    mode: 'test',
    ports,
    cluster: 'bench',
    database: 'tidewarden_bench_http',
    freshDatabase: true,
    stateName: 'bench',
    distDir,
    portVariables: { app: 'TIDEWARDEN_BENCH_PORT', smtp: 'TIDEWARDEN_BENCH_SMTP_PORT', mailApi: 'TIDEWARDEN_BENCH_MAIL_API_PORT', stripe: 'TIDEWARDEN_BENCH_STRIPE_PORT', s3: 'TIDEWARDEN_BENCH_S3_PORT' },
  });
  await waitForHealth(appUrl);
  return runHttpBench({ appUrl, env, distDir });
}

/** The worker's first heartbeat can come a little after the app opens its port; health is 503 until then. */
async function waitForHealth(appUrl, timeoutMs = 90_000) {
  const until = Date.now() + timeoutMs;
  let last = '';
  while (Date.now() < until) {
    try {
      const response = await fetch(`${appUrl}/api/health`);
      last = `${response.status} ${await response.text()}`;
      if (response.status === 200) return;
    } catch (error) {
      last = String(error?.message ?? error);
    }
    await new Promise((r) => setTimeout(r, 1000));
  }
  say(`/api/health did not answer 200 within ${timeoutMs / 1000} s (last: ${last.slice(0, 300)}); measuring anyway, the health rows will say FAILED.`);
}

async function main() {
  ensureNodeModules();
  onShutdown(stopAll);
  const selected = stages();
  const pgPort = portFrom('TIDEWARDEN_BENCH_PG_PORT', 54349);
  if (selected.inProcess) await inProcessStage(pgPort);
  if (selected.http) {
    const { failed } = await httpStage(pgPort);
    if (failed) process.exitCode = 1;
  }
}

main()
  .then(async () => {
    await stopAll();
    process.exit(process.exitCode ?? 0);
  })
  .catch(async (error) => {
    const message = error instanceof BootstrapError ? error.message : `The bench failed: ${error?.stack ?? error}`;
    process.stderr.write(`[tidewarden] ${message}\n`);
    await stopAll();
    process.exit(1);
  });
