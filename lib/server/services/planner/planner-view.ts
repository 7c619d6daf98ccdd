import { RenewalSchema } from '@/entities';
import { proposeNextDockings, type RenewalProposal } from '@/lib/forecast';
import { toDateOnly } from '@/lib/dates/date-only';
import { forecastDateWords } from '@/lib/labels';
import { renewalMarginSentence, renewalPlanWords, renewalRuleSentence, type RenewalPlanSummary } from '@/lib/labels';
import { formatDateOnly } from '@/lib/dates/date-only';
import { requirePermission, type OrgContext } from '../../org-context';
import { computePlans, dockingDate, renewalMarginMonths, renewalRuleOf, type AssetPlan } from './compute-plans';

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
  /** 'vessel' or 'structure': the words follow it (docking or campaign). */
  assetKind: string;
  groupId: string;
  group: string;
  /** The forecast's renew-by date, YYYY-MM-DD (the one date the planner and the asset page show). */
  renewBy: string;
  /** 'proposed' by the scheduler, 'kept' as a planner booked it, or 'no-docking' planned early enough. */
  status: 'proposed' | 'kept' | 'no-docking';
  dockingId: string | null;
  /** YYYY-MM-DD of that docking. */
  dockingDate: string | null;
  /** The margin before the renew-by date has already begun (the group is renewed at the very next docking). */
  overdue: boolean;
  /** YYYY-MM-DD: no planned docking renews the group in time; an unplanned one is needed by then. */
  earlierDockingBy: string | null;
  /** Where the renewal stands, in the words the asset page uses too (renewalPlanWords). */
  words: string;
  /** The scheduler's sentence, with the margin in words. */
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
  /** YYYY-MM-DD: an unplanned docking or campaign is needed by then. */
  earlierDockingBy: string;
  /** Why, in one sentence. */
  reason: string;
}

/** A docking the planner may plan: from class practice (vessels), or earlier than planned for a renewal. */
export interface PlannerSuggestion {
  assetId: string;
  assetName: string;
  /** YYYY-MM-DD. */
  date: string;
  kind: string;
  reason: string;
  /** 'renewal': a group cannot wait for the planned dockings; 'class': class practice. */
  source: 'renewal' | 'class';
}

/** A proposal as the words take it (renewalPlanWords): dates as YYYY-MM-DD. */
export function renewalPlanSummary(proposal: RenewalProposal): Required<RenewalPlanSummary> {
  return {
    status: proposal.status,
    dockingDate: proposal.dockingDate ? toDateOnly(proposal.dockingDate) : null,
    deadline: proposal.deadline ? toDateOnly(proposal.deadline) : null,
    overdue: Boolean(proposal.overdue),
    withinMargin: Boolean(proposal.withinMargin),
    earlierDockingBy: proposal.earlierDocking ? toDateOnly(proposal.earlierDocking.by) : null,
  };
}

/** The scheduler's sentence for a group, with the earlier docking it asks for. */
export const renewalReasonOf = (proposal: RenewalProposal) => (proposal.earlierDocking ? `${proposal.reason} ${proposal.earlierDocking.reason}` : proposal.reason);

/** The planner's row for one group (null when it has nothing to book yet): the same date and words the asset page shows. */
export function plannerRenewBy(p: Pick<AssetPlan, 'asset'>, g: AssetPlan['groups'][number]): PlannerRenewBy | null {
  const proposal = g.proposal;
  const due = g.forecast?.renewBy;
  if (!proposal || !due || (proposal.status !== 'proposed' && proposal.status !== 'kept' && proposal.status !== 'no-docking')) return null;
  const summary = renewalPlanSummary(proposal);
  return {
    assetId: p.asset.id,
    assetName: p.asset.name,
    assetKind: p.asset.kind,
    groupId: g.group.id,
    group: g.group.label,
    renewBy: toDateOnly(due),
    status: proposal.status,
    dockingId: proposal.dockingId ?? null,
    dockingDate: summary.dockingDate,
    overdue: summary.overdue,
    earlierDockingBy: summary.earlierDockingBy,
    words: renewalPlanWords(summary, p.asset.kind),
    reason: renewalReasonOf(proposal),
  };
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

  // Every group with a renewal to book or booked, by its renew-by date (groups with nothing to book yet are left out).
  const renewBy: PlannerRenewBy[] = plans
    .flatMap((p) => p.groups.flatMap((g) => plannerRenewBy(p, g) ?? []))
    .sort((a, b) => a.renewBy.localeCompare(b.renewBy) || a.assetName.localeCompare(b.assetName) || a.group.localeCompare(b.group));
  const needsDocking: PlannerNeedsDocking[] = plans.flatMap((p) =>
    p.groups.flatMap((g) => {
      const e = g.proposal?.earlierDocking;
      const due = g.forecast?.renewBy;
      if (!e || !due) return [];
      return [{ assetId: p.asset.id, assetName: p.asset.name, group: g.group.label, renewBy: toDateOnly(due), overdue: Boolean(g.proposal?.overdue), earlierDockingBy: toDateOnly(e.by), reason: e.reason }];
    }),
  ).sort((a, b) => a.earlierDockingBy.localeCompare(b.earlierDockingBy) || a.assetName.localeCompare(b.assetName));

  // An earlier unplanned docking (a campaign for a structure) for each asset with a group no planned docking renews in
  // time, dated by the most urgent of its groups; the planner turns it into a planned docking with one click.
  const earlier: PlannerSuggestion[] = plans.flatMap((p) => {
    const mine = needsDocking.filter((n) => n.assetId === p.asset.id);
    if (!mine.length) return [];
    const first = mine[0];
    const groups = mine.map((n) => `${n.group} (${forecastDateWords('renewBy')} ${formatDateOnly(n.renewBy)})`).join(', ');
    const kind = p.asset.kind === 'vessel' ? 'unplanned' : 'campaign';
    const when = first.overdue ? `as soon as possible (from ${formatDateOnly(first.earlierDockingBy)})` : `by ${formatDateOnly(first.earlierDockingBy)}`;
    return [{ assetId: p.asset.id, assetName: p.asset.name, date: first.earlierDockingBy, kind, source: 'renewal' as const, reason: `No planned ${kind === 'campaign' ? 'campaign' : 'docking'} renews ${groups} in time: plan one ${when}.` }];
  });

  // Suggestions under class practice, from each vessel's latest docking; dates near an existing one are left out.
  const classPractice: PlannerSuggestion[] = plans
    .filter((p) => p.asset.kind === 'vessel')
    .flatMap((p) => {
      const dated = p.dockings.filter((d) => d.status !== 'cancelled').map((d) => ({ d, at: dockingDate(d) }));
      const last = dated.sort((a, b) => b.at.getTime() - a.at.getTime())[0];
      if (!last) return [];
      const renewal = dated.filter((x) => x.d.kind === 'renewal-survey').sort((a, b) => b.at.getTime() - a.at.getTime())[0];
      return proposeNextDockings({ lastDocking: last.at, lastRenewalSurvey: renewal?.at ?? null, horizonYears: 5 })
        .filter((s) => s.date.getTime() > today.getTime() && !dated.some((x) => Math.abs(x.at.getTime() - s.date.getTime()) < 120 * 86_400_000))
        .slice(0, 2)
        .map((s) => ({ assetId: p.asset.id, assetName: p.asset.name, date: s.date.toISOString().slice(0, 10), kind: s.kind, reason: s.reason, source: 'class' as const }));
    });
  const suggestions = [...earlier, ...classPractice];

  const assets = plans.map((p) => ({ id: p.asset.id, name: p.asset.name, kind: p.asset.kind, outlook: p.outlook }));
  // The rule the dates follow, in words (the asset page states the same sentence).
  const renewalRule = renewalRuleSentence(renewalRuleOf(ctx));
  const marginWords = renewalMarginSentence(renewalMarginMonths(ctx));
  return { dockings, suggestions, renewBy, needsDocking, assets, renewalRule, marginWords };
}
