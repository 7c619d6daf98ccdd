// Runs once when the server starts, in the Node.js runtime only (the Node-only code is imported there):
// - the environment is validated before the first request (lib/server/startup-check.ts);
// - each request's socket address is stamped where the server code can read it (lib/server/peer-address.ts).
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { checkEnvironmentOrExit } = await import('./lib/server/startup-check');
  checkEnvironmentOrExit();
  const { installPeerAddressStamp } = await import('./lib/server/peer-address');
  installPeerAddressStamp();
}
