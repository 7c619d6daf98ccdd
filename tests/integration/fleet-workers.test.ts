// Two workers (scripts/worker.ts, started as the start scripts start it) against one database: every scheduled
// job (docking reminders, weekly digest, billing read-back, housekeeping) runs once per cron slot, not once per
// worker. pg-boss keeps the schedules in PostgreSQL; each worker's clock checks them, but a slot becomes one
// job only: the check runs at most every 30 s across all workers (pgboss.version.cron_on) and the slot is sent
// through pg-boss's own queue with a one-minute singleton per job name.
// To see slots without waiting for :15, :00 or Monday 07:00, the test sets the four schedules to every minute
// once both workers run (they read the schedule table at each check), then counts, per job name, the jobs the
// workers created (pgboss.job and pgboss.archive) against the slots pg-boss fired.
// The workers get a database of their own (<integration database>_workers), so their jobs touch no other test.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { knex, type Knex } from '@mikro-orm/knex';
import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from '@/mikro-orm.config';
import { JOBS, SCHEDULES } from '@/lib/server/scheduled-jobs';

const ROOT = path.resolve(import.meta.dirname, '../..');
const LOCAL_HOSTS = new Set(['127.0.0.1', 'localhost', '::1', '[::1]']);
const itUrl = new URL(process.env.TIDEWARDEN_IT_DATABASE_URL ?? process.env.DATABASE_URL!);
if (!LOCAL_HOSTS.has(itUrl.hostname)) throw new Error(`Refusing to create a workers' database on ${itUrl.hostname}: only a local PostgreSQL is allowed.`);
const workersDb = `${itUrl.pathname.replace(/^\//, '')}_workers`;
const workersUrl = Object.assign(new URL(itUrl.toString()), { pathname: `/${workersDb}` }).toString();
const adminUrl = Object.assign(new URL(itUrl.toString()), { pathname: '/postgres' }).toString();

interface Worker {
  name: string;
  child: ChildProcess;
  output: string[];
  started: Promise<void>;
}

const workers: Worker[] = [];
let db: Knex;

function startWorker(name: string): Worker {
  const output: string[] = [];
  const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/worker.ts'], {
    cwd: ROOT,
    env: { ...process.env, DATABASE_URL: workersUrl },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const started = new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${name} did not start within 60 s:\n${output.join('')}`)), 60_000);
    const onData = (chunk: Buffer) => {
      output.push(chunk.toString());
      if (output.join('').includes('[worker] started')) {
        clearTimeout(timer);
        resolve();
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', (chunk: Buffer) => output.push(chunk.toString()));
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`${name} exited (${code}) during start-up:\n${output.join('')}`));
    });
  });
  started.catch(() => undefined);
  const worker = { name, child, output, started };
  workers.push(worker);
  return worker;
}

async function stopWorker({ child }: Worker) {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((resolve) => child.once('exit', resolve));
  child.kill('SIGTERM');
  await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000))]);
  if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
}

async function withAdmin(sql: string) {
  const admin = knex({ client: 'pg', connection: adminUrl, pool: { min: 0, max: 1 } });
  try {
    await admin.raw(sql);
  } finally {
    await admin.destroy();
  }
}

beforeAll(async () => {
  await withAdmin(`drop database if exists "${workersDb}" with (force)`);
  await withAdmin(`create database "${workersDb}"`);
  const orm = await MikroORM.init(ormConfig(workersUrl));
  await orm.getMigrator().up();
  await orm.close(true);
  db = knex({ client: 'pg', connection: workersUrl, pool: { min: 0, max: 2 } });
});

afterAll(async () => {
  for (const w of workers) await stopWorker(w);
  await db?.destroy();
  await withAdmin(`drop database if exists "${workersDb}" with (force)`);
});

const names = Object.values(JOBS);
type JobRow = { name: string; state: string; retry_count: number; singleton_key: string | null; created_on: Date };
type SlotRow = { job: string; singleton_on: Date };

/** The jobs created in the four queues since `since` by the cron (not the start-up passes, which carry a singleton key). */
async function cronJobs(since: Date): Promise<JobRow[]> {
  const q = `select name, state, retry_count, singleton_key, created_on from pgboss.job where name = any(?) and created_on >= ? and singleton_key is null
             union all
             select name, state, retry_count, singleton_key, created_on from pgboss.archive where name = any(?) and created_on >= ? and singleton_key is null`;
  return (await db.raw(q, [names, since, names, since])).rows;
}

/** The slots pg-boss's clock fired since `since`: one message per job name and minute on its internal send-it queue. */
async function firedSlots(since: Date): Promise<SlotRow[]> {
  const q = `select data->>'name' as job, singleton_on from pgboss.job where name = '__pgboss__send-it' and created_on >= ?
             union all
             select data->>'name' as job, singleton_on from pgboss.archive where name = '__pgboss__send-it' and created_on >= ?`;
  return (await db.raw(q, [since, since])).rows;
}

describe('two workers against one database', () => {
  it('both start when they are started at the same moment on a database the job queue has never used', { timeout: 120_000 }, async () => {
    // pg-boss creates its tables and each queue's on first use; done by two workers at once, that deadlocked
    // (one worker died with "deadlock detected" about every other time). Three rounds, each from scratch.
    for (let round = 0; round < 3; round++) {
      await db.raw('drop schema if exists pgboss cascade');
      const pair = [startWorker(`worker ${round}a`), startWorker(`worker ${round}b`)];
      const outcomes = await Promise.allSettled(pair.map((w) => w.started));
      await Promise.all(pair.map(stopWorker));
      expect(outcomes.filter((o) => o.status === 'rejected').map((o) => String((o as PromiseRejectedResult).reason)), `round ${round + 1}`).toEqual([]);
    }
    const queues: { name: string }[] = (await db.raw('select name from pgboss.queue where name = any(?)', [names])).rows;
    expect(queues.map((q) => q.name).sort()).toEqual([...names].sort());
  });

  it('run each scheduled job once per cron slot', { timeout: 300_000 }, async () => {
    const started = Date.now();
    const one = startWorker('worker 1');
    const two = startWorker('worker 2');
    await Promise.all([one.started, two.started]);

    // Both workers registered the four schedules (the same rows, upserted by name).
    const schedules: { name: string; cron: string }[] = (await db.raw('select name, cron from pgboss.schedule order by name')).rows;
    expect(Object.fromEntries(schedules.map((s) => [s.name, s.cron]))).toEqual(SCHEDULES);

    // Every minute from now on; the workers pick this up at their next check.
    const since: Date = (await db.raw('select now() as now')).rows[0].now;
    await db.raw(`update pgboss.schedule set cron = '* * * * *' where name = any(?)`, [names]);

    // Wait until every job has run in two slots; a slot's window closes 60 s after it opens, so by then a second
    // run of the first slot (from the other worker) would have shown up.
    const deadline = Date.now() + 200_000;
    for (;;) {
      const done = await cronJobs(since);
      const finished = names.map((n) => done.filter((j) => j.name === n && j.state === 'completed').length);
      if (finished.every((c) => c >= 2)) break;
      if (Date.now() > deadline) throw new Error(`not every job ran twice within 200 s: ${JSON.stringify(Object.fromEntries(names.map((n, i) => [n, finished[i]])))}\n${one.output.join('')}\n${two.output.join('')}`);
      await new Promise((r) => setTimeout(r, 2000));
    }
    // Both workers were up the whole time (neither crashed and was replaced).
    expect([one.child.exitCode, two.child.exitCode]).toEqual([null, null]);
    await Promise.all([stopWorker(one), stopWorker(two)]);

    const jobs = await cronJobs(since);
    const slots = await firedSlots(since);
    for (const name of names) {
      const ran = jobs.filter((j) => j.name === name);
      const fired = slots.filter((s) => s.job === name);
      const slotTimes = fired.map((s) => new Date(s.singleton_on).getTime());
      // One message per slot, each slot a different minute...
      expect(new Set(slotTimes).size, name).toBe(slotTimes.length);
      // ...and one job per slot, not one per worker.
      expect(ran.length, `${name}: ${ran.length} jobs for ${fired.length} slots`).toBe(fired.length);
      expect(ran.length, name).toBeGreaterThanOrEqual(2);
      // Each ran once: none was retried, and every one that finished completed (the last may still be queued when
      // the workers stopped).
      expect(ran.every((j) => j.retry_count === 0), name).toBe(true);
      expect(ran.filter((j) => j.state !== 'completed').every((j) => j.state === 'created'), `${name}: ${ran.map((j) => j.state).join(', ')}`).toBe(true);
    }
    // The start-up passes the two workers each asked for became one job each (a singleton per key and period).
    const startup: { name: string; n: string }[] = (await db.raw(`select name, count(*) as n from (select name from pgboss.job where singleton_key = 'startup' union all select name from pgboss.archive where singleton_key = 'startup') s group by name order by name`)).rows;
    console.log(`[fleet-workers] ${jobs.length} scheduled jobs in ${slots.length} slots over ${Math.round((Date.now() - started) / 1000)} s; start-up passes: ${JSON.stringify(startup)}`);
  });
});
