import { NextResponse } from 'next/server';
import { getEm } from '@/lib/server/db';
import { readQueueDepth, readWorkerStatus, type QueueDepth, type WorkerStatus } from '@/lib/server/worker-status';

export const dynamic = 'force-dynamic';

// GET /api/health: the app's, the database's and the worker's status, for monitors and the start script.
// 200 when all is well; 503 when the database is unreachable or no worker has beaten for a minute
// (mail and reminders would not go out).
export async function GET() {
  const started = performance.now();
  let database: { status: 'ok' | 'down'; latencyMs?: number; message?: string };
  let worker: WorkerStatus | { status: 'unknown' } = { status: 'unknown' };
  let queue: QueueDepth | null = null;
  try {
    const em = await getEm();
    await em.getConnection().execute('select 1');
    database = { status: 'ok', latencyMs: Math.round((performance.now() - started) * 10) / 10 };
    worker = await readWorkerStatus(em);
    queue = await readQueueDepth(em);
  } catch {
    database = { status: 'down', message: 'The database is not reachable.' };
  }
  const ok = database.status === 'ok' && worker.status === 'ok';
  return NextResponse.json(
    { status: ok ? 'ok' : 'degraded', app: { status: 'ok', version: process.env.npm_package_version ?? '0.1.0' }, database, worker, queue, time: new Date().toISOString() },
    { status: ok ? 200 : 503 },
  );
}
