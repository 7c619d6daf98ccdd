// Runs once when the server starts: the environment is validated before the first request (see
// lib/server/startup-check.ts). The Node-only code is imported only in the Node.js runtime.
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { checkEnvironmentOrExit } = await import('./lib/server/startup-check');
  checkEnvironmentOrExit();
}
