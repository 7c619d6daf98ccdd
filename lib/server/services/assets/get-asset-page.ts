import { AnodeGroupChangeSchema, DesignSchema, DockingSchema, SurveySchema, ZoneSchema } from '@/entities';
import { parseDateOnly } from '@/lib/dates/date-only';
import { requirePermission, allowed, type OrgContext } from '../../org-context';
import { getAssetOrThrow } from './get-asset';
import { listCatalogue } from '../catalogue/anode-models';
import { loadGroupForecasts } from '../forecast/group-forecasts';
import { inSequence } from '../../sql';

export interface DepletionSeries {
  label: string;
  points: { date: Date; kg: number }[];
  surveys: { date: Date; kg: number }[];
  endKg: number;
  endOfLife: Date | null;
}

/**
 * Everything the asset page shows, read in one place: particulars, zones, designs, surveys, dockings,
 * the installed groups with their forecasts and the depletion curves, the latest changes, and the
 * catalogue when the member may fit anodes.
 */
export async function getAssetPage(ctx: OrgContext, assetId: string, today = new Date()) {
  requirePermission(ctx, 'org:read');
  const asset = await getAssetOrThrow(ctx, assetId, { includeArchived: true });
  const canWrite = allowed(ctx, 'asset:write') && !asset.archivedAt;
  const [zones, designs, surveys, forecasts, catalogue, dockings] = await inSequence(
    () => ctx.em.find(ZoneSchema, { asset, archivedAt: null }, { orderBy: { sortOrder: 'asc', createdAt: 'asc' } }),
    () => ctx.em.find(DesignSchema, { asset }, { orderBy: { revision: 'desc' }, populate: ['preparedBy', 'approvedBy'], exclude: ['inputs', 'basis', 'results', 'anodeModel'] }),
    () => ctx.em.find(SurveySchema, { asset }, { orderBy: { surveyedOn: 'desc' }, limit: 20 }),
    () => loadGroupForecasts(ctx, { assetIds: [asset.id] }),
    () => canWrite ? listCatalogue(ctx) : Promise.resolve([]),
    () => ctx.em.find(DockingSchema, { asset, status: { $ne: 'cancelled' } }, { orderBy: { plannedStart: 'asc' } }),
  );
  const changes = forecasts.length
    ? await ctx.em.find(AnodeGroupChangeSchema, { group: { $in: forecasts.map((f) => f.group.id) } }, { orderBy: { createdAt: 'desc' }, limit: 20, populate: ['group'] })
    : [];

  // The chart runs half a year past the last end of life, so every group's crossing is visible.
  const horizon = new Date(Math.max(today.getTime(), ...forecasts.map((f) => (f.forecast?.endOfLife ?? today).getTime())) + 180 * 86_400_000);
  const series: DepletionSeries[] = forecasts
    .filter((f) => f.forecast)
    .map((f) => {
      const fc = f.forecast!;
      const start = parseDateOnly(f.group.installedOn);
      return {
        label: f.group.label,
        points: fc.remainingSeries(start, horizon, 1).map((p) => ({ date: p.date, kg: p.remainingFraction * fc.installedMassKg })),
        surveys: f.surveys.map((s) => ({ date: s.date, kg: s.remainingFraction * fc.installedMassKg })),
        endKg: fc.endFraction * fc.installedMassKg,
        endOfLife: fc.endOfLife,
      };
    });
  return { today, asset, canWrite, zones, designs, surveys, forecasts, catalogue, dockings, changes, series };
}
