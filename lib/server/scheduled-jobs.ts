// The worker's pg-boss queues and their cron schedules (UTC), in one place for scripts/worker.ts and the tests.
export const JOBS = { reminders: 'docking-reminders', digest: 'weekly-digest', billing: 'billing-reconcile', housekeeping: 'housekeeping', storageSweep: 'storage-sweep' } as const;

export const SCHEDULES: Record<(typeof JOBS)[keyof typeof JOBS], string> = {
  [JOBS.reminders]: '*/15 * * * *',
  [JOBS.digest]: '0 7 * * 1',
  [JOBS.billing]: '*/10 * * * *',
  [JOBS.housekeeping]: '17 * * * *',
  // Nightly: objects in the storage that no row names any more (lib/server/services/storage/sweep-orphan-objects.ts).
  [JOBS.storageSweep]: '41 2 * * *',
};
