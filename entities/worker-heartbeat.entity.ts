import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p } from './common';

// One row per running worker process, touched on every pass of its loop; /api/health reads the newest
// to say whether mail and scheduled jobs are being handled.
export const WorkerHeartbeatSchema = defineEntity({
  name: 'WorkerHeartbeat',
  tableName: 'worker_heartbeat',
  properties: {
    workerId: p.string().length(100).primary(),
    host: p.string().length(255),
    pid: p.integer(),
    startedAt: p.datetime(),
    beatAt: p.datetime(),
  },
});
export type WorkerHeartbeat = InferEntity<typeof WorkerHeartbeatSchema>;
