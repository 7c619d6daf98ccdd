// `npm run bench`: measures the performance targets on this machine. Starts its own
// PostgreSQL cluster ("bench", port TIDEWARDEN_BENCH_PG_PORT, default 54349), migrates a fresh
// `tidewarden_bench` database, runs scripts/bench.ts against it and stops the cluster again,
// also on Ctrl-C. Exit code 0 when the benchmarks ran (over target or not), 1 when one crashed.
import { BootstrapError, ensureNodeModules, onShutdown, portFrom, runTs, say, startCluster, stopAll } from './lib/bootstrap.mjs';

async function main() {
  ensureNodeModules();
  onShutdown(stopAll);
  const cluster = await startCluster({ name: 'bench', port: portFrom('TIDEWARDEN_BENCH_PG_PORT', 54349) });
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

main()
  .then(async () => {
    await stopAll();
    process.exit(0);
  })
  .catch(async (error) => {
    const message = error instanceof BootstrapError ? error.message : `The bench failed: ${error?.stack ?? error}`;
    process.stderr.write(`[tidewarden] ${message}\n`);
    await stopAll();
    process.exit(1);
  });
