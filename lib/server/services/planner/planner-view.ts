import { RenewalSchema } from '@/entities';
import { proposeNextDockings } from '@/lib/forecast';
import { toDateOnly } from '@/lib/dates/date-only';
import { renewalRuleSentence } from '@/lib/words/renewal-rule';
import { requirePermission, type OrgContext } from '../../org-context';
import { computePlans, dockingDate, renewalRuleOf } from './compute-plans';

export interface PlannerDocking {
  id: string;
  assetId: string;
  assetName: string;
  assetKind: string;
  kind: string;
  status: string;
  start: string;
  end: string | null;
  yard: string | null;
  renewals: number;
  openRenewals: number;
  massDueKg: number;
}

/** A group with a renewal to book or booked: its renew-by date and the docking that renews it. */
export interface PlannerRenewBy {
  assetId: string;
  assetName: string;
  groupId: string;
  group: string;
  /** The forecast's renew-by date, YYYY-MM-DD (the one date the planner and the asset page show). */
  renewBy: string;
  /** 'proposed' by the scheduler, 'kept' as a planner booked it, or 'no-docking' planned early enough. */
  status: 'proposed' | 'kept' | 'no-docking';
  dockingId: string | null;
  /** YYYY-MM-DD of that docking. */
  dockingDate: string | null;
  /** No docking: the margin before the renew-by date has already begun. */
  overdue: boolean;
  /** The scheduler's sentence. */
  reason: string;
}

/** A group no planned docking renews in time. */
export interface PlannerNeedsDocking {
  assetId: string;
  assetName: string;
  group: string;
  /** The forecast's renew-by date, YYYY-MM-DD. */
  renewBy: string;
  overdue: boolean;
  reason: string;
}

/** Everything the docking planner shows: dockings with their renewals, suggestions, and groups that cannot reach a docking. */
export async function getPlannerView(ctx: OrgContext, today = new Date()) {
  requirePermission(ctx, 'org:read');
  const plans = await computePlans(ctx, { today });
  const renewals = await ctx.em.find(RenewalSchema, { organisation: ctx.organisation, status: { $ne: 'cancelled' } }, { populate: ['group'], fields: ['status', 'quantity', 'docking', 'group.model'] });
  const byDocking = new Map<string, { count: number; open: number; mass: number }>();
  for (const r of renewals) {
    const entry = byDocking.get(r.docking.id) ?? { count: 0, open: 0, mass: 0 };
    entry.count++;
    if (r.status !== 'fitted') {
      entry.open++;
      entry.mass += r.quantity * r.group.model.netMassKg;
    }
    byDocking.set(r.docking.id, entry);
  }
  const dockings: PlannerDocking[] = plans
    .flatMap((p) => p.dockings.map((d) => ({ d, asset: p.asset })))
    .map(({ d, asset }) => ({
      id: d.id,
      assetId: asset.id,
      assetName: asset.name,
      assetKind: asset.kind,
      kind: d.kind,
      status: d.status,
      start: d.actualStart ?? d.plannedStart,
      end: d.actualEnd ?? d.plannedEnd ?? null,
      yard: d.yard ?? null,
      renewals: byDocking.get(d.id)?.count ?? 0,
      openRenewals: byDocking.get(d.id)?.open ?? 0,
      massDueKg: byDocking.get(d.id)?.mass ?? 0,
    }))
    .sort((a, b) => a.start.localeCompare(b.start));

  // Suggestions under class practice, from each vessel's latest docking; dates near an existing one are left out.
  const suggestions = plans
    .filter((p) => p.asset.kind === 'vessel')
    .flatMap((p) => {
      const dated = p.dockings.filter((d) => d.status !== 'cancelled').map((d) => ({ d, at: dockingDate(d) }));
      const last = dated.sort((a, b) => b.at.getTime() - a.at.getTime())[0];
      if (!last) return [];
      const renewal = dated.filter((x) => x.d.kind === 'renewal-survey').sort((a, b) => b.at.getTime() - a.at.getTime())[0];
      return proposeNextDockings({ lastDocking: last.at, lastRenewalSurvey: renewal?.at ?? null, horizonYears: 5 })
        .filter((s) => s.date.getTime() > today.getTime() && !dated.some((x) => Math.abs(x.at.getTime() - s.date.getTime()) < 120 * 86_400_000))
        .slice(0, 2)
        .map((s) => ({ assetId: p.asset.id, assetName: p.asset.name, date: s.date.toISOString().slice(0, 10), kind: s.kind, reason: s.reason }));
    });

  // Every group with a renewal to book or booked, by its renew-by date (groups with nothing to book yet are left out).
  const renewBy: PlannerRenewBy[] = plans
    .flatMap((p) =>
      p.groups.flatMap((g): PlannerRenewBy[] => {
        const proposal = g.proposal;
        const due = g.forecast?.renewBy;
        if (!proposal || !due || (proposal.status !== 'proposed' && proposal.status !== 'kept' && proposal.status !== 'no-docking')) return [];
        return [{
          assetId: p.asset.id,
          assetName: p.asset.name,
          groupId: g.group.id,
          group: g.group.label,
          renewBy: toDateOnly(due),
          status: proposal.status,
          dockingId: proposal.dockingId ?? null,
          dockingDate: proposal.dockingDate ? toDateOnly(proposal.dockingDate) : null,
          overdue: Boolean(proposal.overdue),
          reason: proposal.reason,
        }];
      }),
    )
    .sort((a, b) => a.renewBy.localeCompare(b.renewBy) || a.assetName.localeCompare(b.assetName) || a.group.localeCompare(b.group));
  const needsDocking: PlannerNeedsDocking[] = renewBy
    .filter((r) => r.status === 'no-docking')
    .map((r) => ({ assetId: r.assetId, assetName: r.assetName, group: r.group, renewBy: r.renewBy, overdue: r.overdue, reason: r.reason }));
  const assets = plans.map((p) => ({ id: p.asset.id, name: p.asset.name, kind: p.asset.kind, outlook: p.outlook }));
  // The rule the dates follow, in words (the asset page states the same sentence).
  const renewalRule = renewalRuleSentence(renewalRuleOf(ctx));
  return { dockings, suggestions, renewBy, needsDocking, assets, renewalRule };
}
