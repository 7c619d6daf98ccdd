// Runs once when the server starts.
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { installPeerAddressStamp } = await import('./lib/server/peer-address');
    installPeerAddressStamp();
  }
}
