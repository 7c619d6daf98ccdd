import type { ListQuery } from '@/lib/schemas/register';
import type { AssetOutlook } from '@/lib/forecast';
import { requirePermission, type OrgContext } from '../../org-context';
import { computePlans, OUTLOOK_WORDS } from '../planner/compute-plans';
import { planSummaryOf, type PlanSummary } from '../planner/stored-outlooks';
import { listAssets, type AssetRow } from './list-assets';

export interface FleetRow extends AssetRow {
  outlook: AssetOutlook | null;
  outlookWords: string | null;
  nextDocking: { id: string; date: string; kind: string } | null;
  massDueAtNextDockingKg: number;
  /** The earliest renew-by date (YYYY-MM-DD) of a group no planned docking renews before that date. */
  renewBy: string | null;
}

/**
 * The fleet overview page: the asset list with each asset's protection outlook, next docking and mass due there.
 * Each live asset's plan summary is the one the unit of work stored when what feeds it last changed, if it was
 * computed for today (the worker refreshes them once a day); any other is computed here, so the page is never
 * a day behind.
 */
export async function listFleet(ctx: OrgContext, query: ListQuery, today = new Date()) {
  requirePermission(ctx, 'org:read');
  const { stored, ...page } = await listAssets(ctx, query, today);
  const summaries = new Map<string, PlanSummary>(stored);
  const missing = query.archived === '1' ? [] : page.rows.filter((r) => !summaries.has(r.id)).map((r) => r.id);
  if (missing.length) for (const plan of await computePlans(ctx, { assetIds: missing, today })) summaries.set(plan.asset.id, planSummaryOf(plan));
  return {
    ...page,
    rows: page.rows.map((row): FleetRow => {
      const summary = row.archived ? null : (summaries.get(row.id) ?? null);
      return {
        ...row,
        outlook: summary?.outlook ?? null,
        outlookWords: summary ? OUTLOOK_WORDS[summary.outlook] : null,
        nextDocking: summary?.nextDocking ?? null,
        massDueAtNextDockingKg: summary?.massDueAtNextDockingKg ?? 0,
        renewBy: summary?.renewBy ?? null,
      };
    }),
  };
}
