import { EnvError, getEnv } from './env';

/**
 * Validates the environment when the server starts (called from instrumentation.ts), so that a production
 * server with missing or demo payment keys refuses to start instead of failing on its first request.
 */
export function checkEnvironmentOrExit() {
  try {
    getEnv();
  } catch (error) {
    if (!(error instanceof EnvError)) throw error;
    console.error(`[tidewarden] refusing to start: ${error.message}`);
    process.exit(1);
  }
}
