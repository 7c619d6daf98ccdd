import os from 'node:os';
import type { EntityManager } from '@mikro-orm/postgresql';

/** The worker touches its heartbeat on every pass (every few seconds); a minute without one means it is stuck or gone. */
export const WORKER_LATE_AFTER_MS = 60_000;

export interface WorkerIdentity {
  workerId: string;
  startedAt: Date;
}

export function newWorkerIdentity(): WorkerIdentity {
  return { workerId: `${os.hostname()}:${process.pid}:${Date.now().toString(36)}`, startedAt: new Date() };
}

/** Called by the worker on every pass of its loop. Rows of workers gone for a day are removed. */
export async function recordHeartbeat(em: EntityManager, worker: WorkerIdentity): Promise<void> {
  await em.execute(
    `insert into worker_heartbeat (worker_id, host, pid, started_at, beat_at) values (?, ?, ?, ?, now())
     on conflict (worker_id) do update set beat_at = now()`,
    [worker.workerId, os.hostname(), process.pid, worker.startedAt],
  );
}

export async function forgetStaleWorkers(em: EntityManager): Promise<void> {
  await em.execute(`delete from worker_heartbeat where beat_at < now() - interval '1 day'`);
}

export interface WorkerStatus {
  status: 'ok' | 'late' | 'never';
  lastHeartbeatAt: string | null;
  secondsSinceHeartbeat: number | null;
  /** Workers that beat within the last minute. */
  running: number;
}

export interface QueueDepth {
  /** E-mail waiting to be sent (queued or waiting for a retry). */
  mailWaiting: number;
  /** Seconds the oldest waiting e-mail has waited, or null when none waits. */
  oldestMailWaitingSeconds: number | null;
  /** E-mail given up after every retry. */
  mailNotDelivered: number;
  /** Scheduled jobs created or waiting for a retry in the job queue. */
  jobsWaiting: number;
}

export async function readWorkerStatus(em: EntityManager): Promise<WorkerStatus> {
  const [row] = await em.execute<{ beat_at: Date | null; age_ms: string | null; running: string }[]>(
    `select max(beat_at) as beat_at,
            (extract(epoch from (now() - max(beat_at))) * 1000)::bigint as age_ms,
            count(*) filter (where beat_at > now() - make_interval(secs => ?)) as running
       from worker_heartbeat`,
    [WORKER_LATE_AFTER_MS / 1000],
  );
  if (!row?.beat_at) return { status: 'never', lastHeartbeatAt: null, secondsSinceHeartbeat: null, running: 0 };
  const ageMs = Number(row.age_ms);
  return {
    status: ageMs <= WORKER_LATE_AFTER_MS ? 'ok' : 'late',
    lastHeartbeatAt: new Date(row.beat_at).toISOString(),
    secondsSinceHeartbeat: Math.max(0, Math.round(ageMs / 1000)),
    running: Number(row.running),
  };
}

export async function readQueueDepth(em: EntityManager): Promise<QueueDepth> {
  const [mail] = await em.execute<{ waiting: string; failed: string; oldest_s: string | null }[]>(
    `select count(*) filter (where status = 'pending') as waiting,
            count(*) filter (where status = 'failed') as failed,
            extract(epoch from (now() - min(created_at) filter (where status = 'pending')))::bigint as oldest_s
       from outbox_message`,
  );
  // The job queue's tables exist once a worker has started.
  const [queue] = await em.execute<{ table: string | null }[]>(`select to_regclass('pgboss.job')::text as table`);
  const [jobs] = queue?.table
    ? await em.execute<{ waiting: string }[]>(`select count(*) as waiting from pgboss.job where state in ('created', 'retry')`)
    : [{ waiting: '0' }];
  return {
    mailWaiting: Number(mail?.waiting ?? 0),
    oldestMailWaitingSeconds: mail?.oldest_s == null ? null : Math.max(0, Number(mail.oldest_s)),
    mailNotDelivered: Number(mail?.failed ?? 0),
    jobsWaiting: Number(jobs?.waiting ?? 0),
  };
}
