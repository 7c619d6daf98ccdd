import { EnvError } from '../../lib/server/env';

/** One sentence for the errors a start-up script meets most, instead of a stack trace. */
export function describeStartupError(error: unknown): string {
  if (error instanceof EnvError) return error.message;
  const e = error as { code?: string; message?: string; address?: string; port?: number };
  if (e?.code === 'ECONNREFUSED') return `Could not reach PostgreSQL${e.address ? ` at ${e.address}:${e.port}` : ''}: is it running, and is DATABASE_URL right?`;
  if (e?.code === '28P01') return 'PostgreSQL refused the password in DATABASE_URL.';
  if (e?.code === '3D000') return 'The database named in DATABASE_URL does not exist; create it first.';
  return e?.message ?? String(error);
}
