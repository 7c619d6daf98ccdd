import { AnodeGroupSchema, DesignSchema, type AnodeGroup } from '@/entities';
import { DEFAULT_RENEWAL_THRESHOLD_REMAINING, forecastGroup, ForecastInputError, type DemandProfile, type GroupForecast } from '@/lib/forecast';
import { StoredRecordError, type DesignRecord } from '@/lib/schemas/design-record';
import { requirePermission, type OrgContext } from '../../org-context';
import { pgArray } from '../../sql';
import { readDesignRecord } from '../designs/read-design-record';
import { shareOfDesignCurrent } from '../register/anode-groups';
import { designDemandProfile } from './design-demand-profile';

export interface GroupWithForecast {
  group: AnodeGroup;
  surveys: { date: Date; remainingFraction: number }[];
  forecast: GroupForecast | null;
  /** The design demand profile the forecast follows (flat for bare steel); null on a constant current (no design linked). */
  demandProfile: DemandProfile | null;
  /** Why there is no forecast (no current basis, bad data), in words. */
  noForecastReason: string | null;
}

const utc = (isoDate: string) => new Date(`${isoDate}T00:00:00Z`);

/** The organisation's renewal threshold as a remaining fraction (25 % by default). */
export function renewalThresholdRemaining(ctx: Pick<OrgContext, 'organisation'>): number {
  const percent = ctx.organisation.renewalThresholdPercent;
  return percent === undefined || percent === null ? DEFAULT_RENEWAL_THRESHOLD_REMAINING : percent / 100;
}

/**
 * Forecasts for the fitted groups of some assets (or all), with their surveyed remaining fractions; at most
 * three statements. A group linked to a design follows that design's demand profile (design-demand-profile.ts),
 * its mean the group's share of the design's mean current; a group without one the constant mean current
 * entered for it. Every forecast dates its renewal at the organisation's renewal threshold.
 */
export async function loadGroupForecasts(ctx: OrgContext, { assetIds }: { assetIds?: string[] } = {}): Promise<GroupWithForecast[]> {
  requirePermission(ctx, 'org:read');
  const groups = await ctx.em.find(
    AnodeGroupSchema,
    { organisation: ctx.organisation, removedOn: null, asset: { archivedAt: null, ...(assetIds ? { id: { $in: assetIds } } : {}) } },
    { populate: ['zone', 'asset'], orderBy: { label: 'asc' } },
  );
  if (!groups.length) return [];
  const readings = await ctx.em.execute<{ anode_group_id: string; surveyed_on: string; remaining_fraction: number }[]>(
    `select r.anode_group_id, to_char(s.surveyed_on, 'YYYY-MM-DD') as surveyed_on, r.remaining_fraction
       from survey_reading r join survey s on s.id = r.survey_id
      where r.remaining_fraction is not null and s.organisation_id = ? and r.anode_group_id = any(?::uuid[])
      order by s.surveyed_on`,
    [ctx.organisation.id, pgArray(groups.map((g) => g.id))],
  );
  const byGroup = new Map<string, { date: Date; remainingFraction: number }[]>();
  for (const r of readings) {
    const list = byGroup.get(r.anode_group_id) ?? [];
    list.push({ date: utc(r.surveyed_on), remainingFraction: Number(r.remaining_fraction) });
    byGroup.set(r.anode_group_id, list);
  }
  const records = await loadDesignRecords(ctx, groups);
  const threshold = renewalThresholdRemaining(ctx);

  return groups.map((group): GroupWithForecast => {
    const surveys = byGroup.get(group.id) ?? [];
    const record = group.design ? records.get(group.design.id) : undefined;
    if (record instanceof StoredRecordError) {
      return { group, surveys, forecast: null, demandProfile: null, noForecastReason: `The linked design cannot be read, so the group is not forecast: ${record.message}` };
    }
    const zoneName = group.zone?.name ?? null;
    const meanShareA = group.meanCurrentA ?? (record ? shareOfDesignCurrent(record.results, zoneName, group.quantity) : null);
    if (meanShareA === null && !surveys.length) {
      return { group, surveys, forecast: null, demandProfile: null, noForecastReason: 'No current basis: link the group to a design or enter its mean current, or survey it.' };
    }
    const demandProfile = record && meanShareA !== null ? designDemandProfile(record, zoneName, meanShareA) : null;
    try {
      const forecast = forecastGroup({
        installedOn: utc(group.installedOn),
        quantity: group.quantity,
        netMassPerAnodeKg: group.model.netMassKg,
        utilisationFactor: group.model.utilisationFactor,
        capacityAhPerKg: group.model.capacityAhPerKg,
        currentA: meanShareA ?? 0,
        demandProfile,
        renewalThresholdRemaining: threshold,
        surveys,
      });
      return { group, surveys, forecast, demandProfile, noForecastReason: null };
    } catch (error) {
      if (!(error instanceof ForecastInputError)) throw error;
      return { group, surveys, forecast: null, demandProfile, noForecastReason: `The group's data cannot be forecast: ${error.message}` };
    }
  });
}

/** The stored records of the groups' designs, parsed once each; a row that does not parse is kept as its error. */
async function loadDesignRecords(ctx: OrgContext, groups: readonly AnodeGroup[]): Promise<Map<string, DesignRecord | StoredRecordError>> {
  const ids = [...new Set(groups.flatMap((g) => (g.design ? [g.design.id] : [])))];
  const out = new Map<string, DesignRecord | StoredRecordError>();
  if (!ids.length) return out;
  const designs = await ctx.em.find(DesignSchema, { id: { $in: ids }, organisation: ctx.organisation });
  for (const design of designs) {
    try {
      out.set(design.id, readDesignRecord(design));
    } catch (error) {
      if (!(error instanceof StoredRecordError)) throw error;
      out.set(design.id, error);
    }
  }
  return out;
}
