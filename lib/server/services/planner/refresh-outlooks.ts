import type { EntityManager } from '@mikro-orm/postgresql';
import { toDateOnly } from '@/lib/dates/date-only';
import { runAsSystem } from '../../unit-of-work';
import { recomputeRenewals } from './recompute-renewals';

/**
 * The worker's daily refresh: forecasts move with the calendar, so every live asset whose summary is not from
 * today (or has none) gets its renewal proposals and outlook recomputed, one organisation per transaction.
 * Returns how many assets were refreshed.
 */
export async function refreshStaleOutlooks(em: EntityManager, today = new Date()): Promise<number> {
  const stale = await em.execute<{ organisation_id: string; ids: string[] }[]>(
    `select a.organisation_id, array_agg(a.id::text order by a.id) as ids
       from asset a left join asset_outlook o on o.asset_id = a.id
      where a.archived_at is null and (o.asset_id is null or o.computed_on <> ?::date)
      group by a.organisation_id`,
    [toDateOnly(today)],
  );
  let refreshed = 0;
  for (const { organisation_id, ids } of stale) {
    try {
      const { plans } = await runAsSystem(organisation_id, (ctx) => recomputeRenewals(ctx, ids, today), { em: em.fork() });
      refreshed += plans.length;
    } catch (error) {
      // One organisation's bad data must not keep the others stale; its fleet overview computes on the spot meanwhile.
      console.error(`[tidewarden] outlook refresh failed for organisation ${organisation_id}:`, error instanceof Error ? error.message : error);
    }
  }
  return refreshed;
}
