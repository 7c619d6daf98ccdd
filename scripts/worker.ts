// Background worker: delivers the e-mail outbox (and, later, scheduled jobs). Safe to run in several
// copies: rows are claimed with FOR UPDATE SKIP LOCKED.
import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from '../mikro-orm.config';
import { getEnv } from '../lib/server/env';
import { describeStartupError } from './lib/describe-error';
import { deliverDueMail } from '../lib/server/mail/outbox';

const INTERVAL_MS = Number(process.env.TIDEWARDEN_WORKER_INTERVAL_MS ?? 3000);

async function main() {
  const orm = await MikroORM.init(ormConfig(getEnv().DATABASE_URL));
  let stopping = false;
  const stop = async () => {
    stopping = true;
    await orm.close(true);
    process.exit(0);
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
  console.log('[worker] started');
  while (!stopping) {
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
