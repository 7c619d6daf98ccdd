// Runs once when the server starts. The environment is validated here rather than on the first request,
// so that a production server with missing or demo payment keys refuses to start instead of serving.
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { getEnv, EnvError } = await import('./lib/server/env');
  try {
    getEnv();
  } catch (error) {
    if (!(error instanceof EnvError)) throw error;
    console.error(`[tidewarden] refusing to start: ${error.message}`);
    process.exit(1);
  }
}
