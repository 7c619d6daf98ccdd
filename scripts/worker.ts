// Background worker, started by `npm start`. It delivers the e-mail outbox (rows claimed with
// FOR UPDATE SKIP LOCKED) and runs the scheduled jobs through pg-boss, a job queue kept in
// PostgreSQL: its schedules fire once per tick however many workers run, and the reminders
// themselves are queued with dedupe keys, so each is sent exactly once.
import { MikroORM } from '@mikro-orm/postgresql';
import PgBoss from 'pg-boss';
import { ormConfig } from '../mikro-orm.config';
import { getEnv } from '../lib/server/env';
import { deliverDueMail } from '../lib/server/mail/outbox';
import { queueDockingReminders } from '../lib/server/services/reminders/docking-reminders';
import { queueWeeklyDigests } from '../lib/server/services/reminders/weekly-digest';
import { forgetStaleWorkers, newWorkerIdentity, recordHeartbeat } from '../lib/server/worker-status';
import { reconcileAllSubscriptions } from '../lib/server/services/billing/reconcile-subscription';
import { deleteExpiredIdempotencyKeys } from '../lib/server/idempotency';
import { purgeDeletedSurveys } from '../lib/server/services/surveys/manage-surveys';
import { purgeAttachmentBin } from '../lib/server/services/surveys/attachments';
import { sweepOrphanObjects } from '../lib/server/services/storage/sweep-orphan-objects';
import { moveStoredFilesToObjectStorage } from '../lib/server/storage/move-stored-files';
import { getStorage } from '../lib/server/storage/object-storage';
import { refreshStaleOutlooks } from '../lib/server/services/planner/refresh-outlooks';
import { describeStartupError } from './lib/describe-error';
import { JOBS, SCHEDULES } from '../lib/server/scheduled-jobs';

const INTERVAL_MS = Number(process.env.TIDEWARDEN_WORKER_INTERVAL_MS ?? 3000);
export { JOBS };

async function main() {
  const env = getEnv();
  const orm = await MikroORM.init(ormConfig(env.DATABASE_URL));
  const boss = new PgBoss({ connectionString: env.DATABASE_URL, schema: 'pgboss', max: 3 });
  boss.on('error', (error) => console.error('[worker] job queue error:', error.message));
  // pg-boss creates a queue's tables the first time it is asked for the queue, and two workers doing that at the
  // same moment deadlock in PostgreSQL (each inserts its queue row, then each needs a lock on the queue table the
  // other's insert holds), so one of them died at start on a fresh database. Workers take their start one at a
  // time: a transaction-level advisory lock, held on a connection of the ORM while pg-boss works on its own.
  await orm.em.fork().transactional(async (tx) => {
    await tx.execute(`select pg_advisory_xact_lock(hashtext('tidewarden:worker-start'))`);
    await boss.start();
    for (const name of Object.values(JOBS)) await boss.createQueue(name);
  });
  // Photos and reports still kept in PostgreSQL (a release whose `migrate.ts up` stopped half-way, say while the
  // storage was down) go to the object storage, row by row, in the background; the clean-up job waits for it.
  const moverEm = orm.em.fork();
  void moveStoredFilesToObjectStorage((sql, params) => moverEm.execute(sql, params ?? []), () => getStorage())
    .then((moved) => {
      const total = moved.attachments + moved.attachmentBin + moved.surveyBin;
      if (total) console.log(`[worker] moved ${total} stored file(s) from PostgreSQL into the object storage`);
    })
    .catch((error) => console.error(`[worker] moving stored files into the object storage stopped (the next start carries on): ${error instanceof Error ? error.message : error}`));
  await boss.schedule(JOBS.reminders, SCHEDULES[JOBS.reminders], {}, { tz: 'UTC' });
  await boss.schedule(JOBS.digest, SCHEDULES[JOBS.digest], {}, { tz: 'UTC' });
  await boss.work(JOBS.reminders, async () => {
    const { queued, failed } = await queueDockingReminders(orm.em.fork());
    if (queued || failed) console.log(`[worker] docking reminders queued: ${queued}${failed ? `; ${failed} could not be prepared (tried again next pass)` : ''}`);
  });
  await boss.work(JOBS.digest, async () => {
    const { queued } = await queueWeeklyDigests(orm.em.fork());
    console.log(`[worker] weekly digests queued: ${queued}`);
  });
  // One reminder pass soon after start, shared by every worker that starts within five minutes.
  await boss.send(JOBS.reminders, {}, { singletonKey: 'startup', singletonSeconds: 300 });
  // Billing: the subscriptions are read back from the payment service every 10 minutes and once at
  // start, so that webhooks lost while the app was down (a cancellation, a failed payment) still count.
  await boss.schedule(JOBS.billing, SCHEDULES[JOBS.billing], {}, { tz: 'UTC' });
  await boss.work(JOBS.billing, async () => {
    const { checked, changed, failed } = await reconcileAllSubscriptions(orm.em.fork());
    if (changed || failed) console.log(`[worker] subscriptions reconciled: ${checked} checked, ${changed} repaired, ${failed} could not be checked`);
  });
  await boss.send(JOBS.billing, {}, { singletonKey: 'startup', singletonSeconds: 60 });
  // Housekeeping, hourly: idempotency keys older than their window (48 h) answer no repeat any more, and
  // deleted surveys leave the bin once they can no longer be restored (30 days), and the plan summaries the fleet
  // overview reads are brought to the new day (until then the overview computes a stale one on the spot).
  await boss.schedule(JOBS.housekeeping, SCHEDULES[JOBS.housekeeping], {}, { tz: 'UTC' });
  await boss.send(JOBS.housekeeping, {}, { singletonKey: 'startup', singletonSeconds: 300 });
  await boss.work(JOBS.housekeeping, async () => {
    // First, so that a failure of the clean-ups below does not leave the overview on yesterday's summaries.
    const outlooks = await refreshStaleOutlooks(orm.em.fork());
    if (outlooks) console.log(`[worker] asset outlooks brought to today: ${outlooks}`);
    const removed = await deleteExpiredIdempotencyKeys(orm.em.fork());
    if (removed) console.log(`[worker] expired idempotency keys removed: ${removed}`);
    const purged = await purgeDeletedSurveys(orm.em.fork());
    if (purged) console.log(`[worker] deleted surveys past their restore window removed: ${purged}`);
    const files = await purgeAttachmentBin(orm.em.fork());
    if (files) console.log(`[worker] deleted attachments past their undo window removed: ${files}`);
  });
  // Nightly: the objects in the storage that no row names any more (the safety net behind the deletes after commit).
  await boss.schedule(JOBS.storageSweep, SCHEDULES[JOBS.storageSweep], {}, { tz: 'UTC' });
  await boss.work(JOBS.storageSweep, async () => {
    const { skipped, listed, deleted, staleUploads } = await sweepOrphanObjects(orm.em.fork());
    if (skipped) return console.log('[worker] storage clean-up skipped: some photos or reports still await the move into the object storage');
    console.log(`[worker] storage clean-up: ${listed} files checked, ${deleted} without a record removed, ${staleUploads} unfinished uploads forgotten`);
  });

  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    await boss.stop({ graceful: true, timeout: 5000 }).catch(() => undefined);
    await orm.close(true);
    process.exit(0);
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
  const identity = newWorkerIdentity();
  await forgetStaleWorkers(orm.em.fork()).catch(() => undefined);
  console.log('[worker] started: outbox delivery and scheduled jobs');
  while (!stopping) {
    try {
      // The heartbeat /api/health reads: this loop is alive and reaches the database.
      await recordHeartbeat(orm.em.fork(), identity);
    } catch (error) {
      console.error('[worker] heartbeat failed:', error instanceof Error ? error.message : error);
    }
    try {
      const result = await deliverDueMail(orm.em.fork());
      if (result.claimed) console.log(`[worker] mail: ${result.sent} sent, ${result.failed} to retry`);
    } catch (error) {
      console.error('[worker] outbox pass failed:', error instanceof Error ? error.message : error);
    }
    await new Promise((r) => setTimeout(r, INTERVAL_MS));
  }
}

main().catch((error) => {
  console.error(`[worker] could not start: ${describeStartupError(error)}`);
  process.exit(1);
});
