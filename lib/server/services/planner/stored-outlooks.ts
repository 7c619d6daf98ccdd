import type { AssetOutlook } from '@/lib/forecast';
import { toDateOnly } from '@/lib/dates/date-only';
import type { Asset } from '@/entities';
import type { OrgContext } from '../../org-context';
import { pgArray } from '../../sql';
import { dockingDate, type AssetPlan } from './compute-plans';

/**
 * What the fleet overview shows of an asset's plan. Computed from a plan here, and only here, whether it
 * is stored (storeOutlooks, by the unit of work) or computed on the spot for an asset whose stored summary
 * is not from today.
 */
export interface PlanSummary {
  outlook: AssetOutlook;
  nextDocking: { id: string; date: string; kind: string } | null;
  massDueAtNextDockingKg: number;
  /** The earliest renew-by date (YYYY-MM-DD) of a group no planned docking renews before that date. */
  renewBy: string | null;
}

export function planSummaryOf(plan: AssetPlan): PlanSummary {
  const next = plan.nextDocking;
  const renewBy = plan.groups
    .filter((g) => g.proposal?.earlierDocking)
    .map((g) => g.forecast?.renewBy)
    .filter((d): d is Date => Boolean(d))
    .sort((a, b) => a.getTime() - b.getTime())[0];
  return {
    outlook: plan.outlook,
    nextDocking: next ? { id: next.id, date: toDateOnly(dockingDate(next)), kind: next.kind } : null,
    massDueAtNextDockingKg: next ? (plan.massDue.find((m) => m.dockingId === next.id)?.massKg ?? 0) : 0,
    renewBy: renewBy ? toDateOnly(renewBy) : null,
  };
}

/**
 * Stores the plans' summaries as of `today` (its UTC day), in one statement, inside the caller's transaction:
 * they commit with the change that moved them or not at all. recomputeRenewals has locked the assets' rows (in
 * id order) before computing, so two changes to one asset store one after the other, each from committed data.
 */
export async function storeOutlooks(ctx: Pick<OrgContext, 'em' | 'organisation'>, plans: readonly AssetPlan[], today: Date) {
  if (!plans.length) return;
  const day = toDateOnly(today);
  const rows = [...plans].sort((a, b) => (a.asset.id < b.asset.id ? -1 : a.asset.id > b.asset.id ? 1 : 0)).map((plan) => ({ id: plan.asset.id, ...planSummaryOf(plan) }));
  await ctx.em.execute(
    `insert into asset_outlook (asset_id, organisation_id, computed_on, outlook, next_docking_id, mass_due_next_kg, renew_by, version, updated_at)
     select t.asset_id, ?::uuid, ?::date, t.outlook, t.next_docking_id, t.mass_due_next_kg, t.renew_by, gen_random_uuid(), now()
       from unnest(?::uuid[], ?::text[], ?::uuid[], ?::float8[], ?::date[]) as t(asset_id, outlook, next_docking_id, mass_due_next_kg, renew_by)
     on conflict (asset_id) do update set computed_on = excluded.computed_on, outlook = excluded.outlook, next_docking_id = excluded.next_docking_id,
       mass_due_next_kg = excluded.mass_due_next_kg, renew_by = excluded.renew_by, version = excluded.version, updated_at = excluded.updated_at`,
    [
      ctx.organisation.id,
      day,
      pgArray(rows.map((r) => r.id)),
      pgArray(rows.map((r) => r.outlook)),
      pgArray(rows.map((r) => r.nextDocking?.id ?? null)),
      pgArray(rows.map((r) => r.massDueAtNextDockingKg)),
      pgArray(rows.map((r) => r.renewBy)),
    ],
    'run',
  );
}

/** A stored summary as read back with the asset list (null when none is stored, or it is not from `today`). */
export function storedSummary(row: Record<string, unknown>, today: Date): PlanSummary | null {
  if (row.outlook_on !== toDateOnly(today) || !row.stored_outlook) return null;
  return {
    outlook: row.stored_outlook as AssetOutlook,
    nextDocking: row.next_docking_id ? { id: row.next_docking_id as string, date: row.next_docking_on as string, kind: row.next_docking_kind as string } : null,
    massDueAtNextDockingKg: Number(row.mass_due_next_kg ?? 0),
    renewBy: (row.renew_by as string | null) ?? null,
  };
}

// ---------- the asset page's plan, kept per process while its stored version stands ----------

const KEPT_PLANS = 256;
const keptPlans = new Map<string, { version: string; day: string; plan: AssetPlan }>();

/**
 * The plan of one asset (what the asset page shows: forecasts, proposals, outlook), computed once per stored
 * version. The unit of work stores a new version (storeOutlooks) in the transaction of every change that feeds
 * the plan, so a plan kept here under the version read now was computed from the same data; a version of
 * another day, or none, is computed afresh and not kept. Several app instances each keep their own, all keyed
 * on the one version in PostgreSQL. At most KEPT_PLANS plans, the least recently used dropped first.
 */
export async function assetPlanFor(
  ctx: OrgContext,
  asset: Asset,
  today: Date,
  compute: () => Promise<AssetPlan | null>,
  /** The stored version and day when the caller read them already (read before anything the plan is computed from); null: none stored. */
  read?: { version: string; day: string } | null,
): Promise<AssetPlan | null> {
  if (asset.archivedAt) return compute();
  const day = toDateOnly(today);
  const [stored] =
    read !== undefined
      ? read ? [read] : []
      : await ctx.em.execute<{ version: string; day: string }[]>(
          `select version, to_char(computed_on, 'YYYY-MM-DD') as day from asset_outlook where asset_id = ? and organisation_id = ?`,
          [asset.id, ctx.organisation.id],
        );
  const kept = keptPlans.get(asset.id);
  if (stored && stored.day === day && kept && kept.version === stored.version && kept.day === day) {
    keptPlans.delete(asset.id);
    keptPlans.set(asset.id, kept);
    return kept.plan;
  }
  const plan = await compute();
  if (plan && stored && stored.day === day) {
    keptPlans.delete(asset.id);
    keptPlans.set(asset.id, { version: stored.version, day, plan });
    if (keptPlans.size > KEPT_PLANS) keptPlans.delete(keptPlans.keys().next().value!);
  }
  return plan;
}

/** For tests: forget every kept plan. */
export function forgetKeptPlans() {
  keptPlans.clear();
}
