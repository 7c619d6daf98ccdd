import type { ListQuery } from '@/lib/schemas/register';
import type { AssetOutlook } from '@/lib/forecast';
import { toDateOnly } from '@/lib/dates/date-only';
import { requirePermission, type OrgContext } from '../../org-context';
import { computePlans, dockingDate, OUTLOOK_WORDS } from '../planner/compute-plans';
import { listAssets, type AssetRow } from './list-assets';

export interface FleetRow extends AssetRow {
  outlook: AssetOutlook | null;
  outlookWords: string | null;
  nextDocking: { id: string; date: string; kind: string } | null;
  massDueAtNextDockingKg: number;
  /** The earliest renew-by date (YYYY-MM-DD) of a group no planned docking renews before that date. */
  renewBy: string | null;
}

/** The fleet overview page: the asset list with each asset's protection outlook, next docking and mass due there. */
export async function listFleet(ctx: OrgContext, query: ListQuery) {
  requirePermission(ctx, 'org:read');
  const page = await listAssets(ctx, query);
  const plans = query.archived === '1' ? [] : await computePlans(ctx, { assetIds: page.rows.map((r) => r.id) });
  const byAsset = new Map(plans.map((p) => [p.asset.id, p]));
  return {
    ...page,
    rows: page.rows.map((row): FleetRow => {
      const plan = byAsset.get(row.id);
      const next = plan?.nextDocking ?? null;
      const renewBy = plan?.groups.filter((g) => g.proposal?.earlierDocking).map((g) => g.forecast?.renewBy).filter((d): d is Date => Boolean(d)).sort((a, b) => a.getTime() - b.getTime())[0] ?? null;
      return {
        ...row,
        outlook: plan?.outlook ?? null,
        outlookWords: plan ? OUTLOOK_WORDS[plan.outlook] : null,
        nextDocking: next ? { id: next.id, date: dockingDate(next).toISOString().slice(0, 10), kind: next.kind } : null,
        massDueAtNextDockingKg: next ? (plan!.massDue.find((m) => m.dockingId === next.id)?.massKg ?? 0) : 0,
        renewBy: renewBy ? toDateOnly(renewBy) : null,
      };
    }),
  };
}
