import { NextResponse } from 'next/server';
import { getEm } from '@/lib/server/db';

export const dynamic = 'force-dynamic';

// GET /api/health: the app's and the database's status, for monitors and the start script.
export async function GET() {
  const started = performance.now();
  let database: { status: 'ok' | 'down'; latencyMs?: number; message?: string };
  try {
    const em = await getEm();
    await em.getConnection().execute('select 1');
    database = { status: 'ok', latencyMs: Math.round((performance.now() - started) * 10) / 10 };
  } catch {
    database = { status: 'down', message: 'The database is not reachable.' };
  }
  const ok = database.status === 'ok';
  return NextResponse.json({ status: ok ? 'ok' : 'degraded', app: { status: 'ok', version: process.env.npm_package_version ?? '0.1.0' }, database, time: new Date().toISOString() }, { status: ok ? 200 : 503 });
}
