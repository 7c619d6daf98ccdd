import { AnodeGroupSchema, type AnodeGroup } from '@/entities';
import { forecastGroup, ForecastInputError, type GroupForecast } from '@/lib/forecast';
import { requirePermission, type OrgContext } from '../../org-context';

export interface GroupWithForecast {
  group: AnodeGroup;
  surveys: { date: Date; remainingFraction: number }[];
  forecast: GroupForecast | null;
  /** Why there is no forecast (no current basis, bad data), in words. */
  noForecastReason: string | null;
}

const utc = (isoDate: string) => new Date(`${isoDate}T00:00:00Z`);

/** Forecasts for the fitted groups of some assets (or all), with their surveyed remaining fractions; three statements. */
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
    [ctx.organisation.id, `{${groups.map((g) => g.id).join(',')}}`],
  );
  const byGroup = new Map<string, { date: Date; remainingFraction: number }[]>();
  for (const r of readings) {
    const list = byGroup.get(r.anode_group_id) ?? [];
    list.push({ date: utc(r.surveyed_on), remainingFraction: Number(r.remaining_fraction) });
    byGroup.set(r.anode_group_id, list);
  }
  return groups.map((group) => {
    const surveys = byGroup.get(group.id) ?? [];
    if (group.meanCurrentA === null || group.meanCurrentA === undefined) {
      if (!surveys.length) return { group, surveys, forecast: null, noForecastReason: 'No current basis: link the group to a design or enter its mean current, or survey it.' };
    }
    try {
      const forecast = forecastGroup({
        installedOn: utc(group.installedOn),
        quantity: group.quantity,
        netMassPerAnodeKg: group.model.netMassKg,
        utilisationFactor: group.model.utilisationFactor,
        capacityAhPerKg: group.model.capacityAhPerKg,
        currentA: group.meanCurrentA ?? 0,
        surveys,
      });
      return { group, surveys, forecast, noForecastReason: null };
    } catch (error) {
      if (!(error instanceof ForecastInputError)) throw error;
      return { group, surveys, forecast: null, noForecastReason: `The group's data cannot be forecast: ${error.message}` };
    }
  });
}
