import { AssetSchema, DockingSchema, RenewalSchema, type Asset, type Docking, type Renewal } from '@/entities';
import { DEFAULT_MARGIN_MONTHS, assetOutlook, massDueKg, proposeRenewals, type AssetOutlook, type MassDue, type RenewalProposal } from '@/lib/forecast';
import { classifyPotential } from '@/lib/surveys/criteria';
import { surveyCriteriaOf } from '@/lib/register/protected-metal';
import { requirePermission, type OrgContext } from '../../org-context';
import type { RenewalRuleSettings } from '@/lib/labels';
import { loadGroupForecasts, renewalThresholdRemaining, type GroupWithForecast } from '../forecast/group-forecasts';
import { inSequence, pgArray } from '../../sql';

export interface AssetPlan {
  asset: Asset;
  groups: (GroupWithForecast & { proposal: RenewalProposal | null; booked: Renewal | null })[];
  dockings: Docking[];
  nextDocking: Docking | null;
  outlook: AssetOutlook;
  underProtectedBySurvey: boolean;
  /** The latest survey has a reading more negative than the asset's over-protection limit. */
  overProtectedBySurvey: boolean;
  massDue: MassDue[];
}

/** The organisation's renewal margin, months between a renewal's docking and the group's renew-by date. */
export const renewalMarginMonths = (ctx: Pick<OrgContext, 'organisation'>) => ctx.organisation.renewalMarginMonths ?? DEFAULT_MARGIN_MONTHS;

/** The two settings the renewal rule is stated with (renewalRuleSentence), as the scheduler uses them. */
export const renewalRuleOf = (ctx: Pick<OrgContext, 'organisation'>): RenewalRuleSettings => ({
  marginMonths: renewalMarginMonths(ctx),
  thresholdPercent: Math.round(renewalThresholdRemaining(ctx) * 100),
});

const day = (iso: string) => new Date(`${iso}T00:00:00Z`);
/** The date a docking counts from: its actual start once known, else the planned one. */
export const dockingDate = (d: Pick<Docking, 'plannedStart' | 'actualStart'>) => day(d.actualStart ?? d.plannedStart);

/**
 * Forecast, renewal proposals and protection outlook for some assets (or the whole organisation),
 * in a fixed number of statements whatever the fleet size. Renewals are scheduled on each group's
 * renew-by date (the organisation's renewal threshold, or the utilisation factor if that comes first)
 * less the organisation's renewal margin.
 */
export async function computePlans(ctx: OrgContext, { assetIds, today = new Date() }: { assetIds?: string[]; today?: Date } = {}): Promise<AssetPlan[]> {
  requirePermission(ctx, 'org:read');
  const assets = await ctx.em.find(AssetSchema, { organisation: ctx.organisation, archivedAt: null, ...(assetIds ? { id: { $in: assetIds } } : {}) }, { orderBy: { name: 'asc' } });
  if (!assets.length) return [];
  const ids = assets.map((a) => a.id);
  const [forecasts, dockings, booked, latest] = await inSequence(
    () => loadGroupForecasts(ctx, { assetIds: ids }),
    () => ctx.em.find(DockingSchema, { asset: { $in: ids }, status: { $ne: 'cancelled' } }, { orderBy: { plannedStart: 'asc' } }),
    () => ctx.em.find(RenewalSchema, { organisation: ctx.organisation, status: { $in: ['confirmed', 'ordered'] }, group: { asset: { $in: ids } } }, { populate: ['docking'] }),
    () => ctx.em.execute<{ asset_id: string; least_negative: number | null; most_negative: number | null }[]>(
      `select distinct on (s.asset_id) s.asset_id,
              (select max(r.potential_ag_ag_cl_v) from survey_reading r where r.survey_id = s.id) as least_negative,
              (select min(r.potential_ag_ag_cl_v) from survey_reading r where r.survey_id = s.id) as most_negative
         from survey s where s.organisation_id = ? and s.asset_id = any(?::uuid[]) order by s.asset_id, s.surveyed_on desc, s.created_at desc`,
      [ctx.organisation.id, pgArray(ids)],
    ),
  );
  // The latest survey's extremes, V vs Ag/AgCl/seawater: the least negative reading decides under-protection, the most negative over-protection.
  const extremes = new Map(latest.map((r) => [r.asset_id, { least: r.least_negative === null ? null : Number(r.least_negative), most: r.most_negative === null ? null : Number(r.most_negative) }]));
  const bookedByGroup = new Map(booked.map((r) => [r.group.id, r]));
  return assets.map((asset) => {
    const groups = forecasts.filter((f) => f.group.asset.id === asset.id);
    const assetDockings = dockings.filter((d) => d.asset.id === asset.id);
    const usable = assetDockings.filter((d) => d.status === 'planned');
    const proposals = proposeRenewals({
      today,
      assetKind: asset.kind,
      marginMonths: renewalMarginMonths(ctx),
      dockings: usable.map((d) => ({ id: d.id, date: dockingDate(d), status: d.status })),
      groups: groups
        .filter((g) => g.forecast)
        .map((g) => ({ id: g.group.id, renewBy: g.forecast!.renewBy, renewByEarly: g.forecast!.renewByEarly, confirmedRenewal: bookedByGroup.has(g.group.id) ? { dockingId: bookedByGroup.get(g.group.id)!.docking.id } : null })),
    });
    const byGroup = new Map(proposals.map((p) => [p.groupId, p]));
    const nextDocking = usable.find((d) => dockingDate(d).getTime() >= today.getTime() - 86_400_000) ?? null;
    const criteria = surveyCriteriaOf(asset);
    const { least = null, most = null } = extremes.get(asset.id) ?? {};
    const underProtectedBySurvey = least !== null && classifyPotential({ potentialAgAgClV: least, ...criteria }).status === 'under-protected';
    const overProtectedBySurvey = most !== null && classifyPotential({ potentialAgAgClV: most, ...criteria }).status === 'over-protected';
    const outlook = assetOutlook({ groupStatuses: proposals, underProtectedBySurvey, overProtectedBySurvey, today, anodesRecorded: groups.length > 0, nextDockingId: nextDocking?.id ?? null });
    const netMass = new Map(groups.map((g) => [g.group.id, g.group.quantity * g.group.model.netMassKg]));
    return {
      asset,
      groups: groups.map((g) => ({ ...g, proposal: byGroup.get(g.group.id) ?? null, booked: bookedByGroup.get(g.group.id) ?? null })),
      dockings: assetDockings,
      nextDocking,
      outlook,
      underProtectedBySurvey,
      overProtectedBySurvey,
      massDue: massDueKg(proposals, netMass),
    };
  });
}

export { OUTLOOK_WORDS } from '@/lib/labels';
