// `npm start`: installs what is missing, starts PostgreSQL, migrates, seeds once, starts the fakes,
// builds when stale and serves the app. Ctrl-C stops everything it started.
import { ensureNodeModules, say, stopAll, onShutdown, portFrom, BootstrapError } from './lib/bootstrap.mjs';
import { bringUp, demoSignIns } from './lib/services.mjs';

async function main() {
  ensureNodeModules();
  onShutdown(stopAll);
  const ports = {
    app: portFrom('PORT', 3000),
    pg: portFrom('TIDEWARDEN_PG_PORT', 54329),
    smtp: portFrom('FAKE_SMTP_PORT', 2525),
    mailApi: portFrom('FAKE_MAIL_API_PORT', 2526),
    stripe: portFrom('FAKE_STRIPE_PORT', 12111),
    s3: portFrom('FAKE_S3_PORT', 12121),
  };
  const { appUrl } = await bringUp({ mode: 'development', ports, cluster: 'dev', database: 'tidewarden', freshDatabase: false, distDir: '.next' });
  const demo = demoSignIns();
  say('');
  say(`Tidewarden is running at ${appUrl}`);
  say(`Demo organisation: ${demo.organisation.name} (${appUrl}/o/${demo.organisation.slug})`);
  say(`Demo sign-ins (password for all: ${demo.password}):`);
  for (const user of demo.users) say(`  ${user.role.padEnd(9)} ${user.email}`);
  say(`Mail sent by the app: ${appUrl}/dev/inbox`);
  say('Press Ctrl-C to stop.');
}

main().catch(async (error) => {
  const message = error instanceof BootstrapError ? error.message : `Start-up failed: ${error?.message ?? error}`;
  process.stderr.write(`[tidewarden] ${message}\n`);
  await stopAll();
  process.exit(1);
});
