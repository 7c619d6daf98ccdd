import { AnodeGroupChangeSchema, DesignSchema, DockingSchema, SurveySchema, ZoneSchema } from '@/entities';
import { parseDateOnly, toDateOnly } from '@/lib/dates/date-only';
import { renewalMarginSentence, renewalPlanWords, renewalRuleSentence } from '@/lib/labels';
import { requirePermission, allowed, type OrgContext } from '../../org-context';
import { getAssetOrThrow } from './get-asset';
import { listCatalogue } from '../catalogue/anode-models';
import type { GroupWithForecast } from '../forecast/group-forecasts';
import { computePlans, renewalMarginMonths, renewalRuleOf, type AssetPlan } from '../planner/compute-plans';
import { renewalPlanSummary, renewalReasonOf } from '../planner/planner-view';
import { inSequence } from '../../sql';
import { assetPlanFor } from '../planner/stored-outlooks';
import { loadAssetDrawing } from './asset-drawing';

export type { DepletionSeries } from '@/lib/register/depletion-series';
import type { DepletionSeries } from '@/lib/register/depletion-series';

/** One row of the asset page's forecast table; dates are YYYY-MM-DD. */
export interface ForecastRow {
  groupId: string;
  label: string;
  installedNetKg: number;
  /** kg/yr at the forecast's start (installation or the latest survey); null without a forecast. */
  ratePerYearKg: number | null;
  /** What the forecast runs on, in words, or why there is none. */
  basis: string;
  /** The forecast's renew-by date: the one date renewals are scheduled on (the planner shows the same). */
  renewBy: string | null;
  renewByEarly: string | null;
  renewByLate: string | null;
  /** Secondary: when the utilisation factor is used up. */
  endOfLife: string | null;
  /** Where the group's renewal stands, in the planner's words (renewalPlanWords); null without a forecast. */
  renewal: string | null;
  /** The scheduler's sentence, with the margin in words. */
  renewalReason: string | null;
}

const dayOrNull = (d: Date | null | undefined) => (d ? toDateOnly(d) : null);

/**
 * The depletion chart's step: a month, or longer so a line has at most about CHART_POINTS points. The chart is
 * some 700 drawing units wide; a point a month over a horizon of decades only added weight to the page.
 */
const CHART_POINTS = 120;
export function chartStepMonths(from: Date, to: Date): number {
  const months = (to.getTime() - from.getTime()) / (30.436875 * 86_400_000);
  return Math.max(1, Math.ceil(months / CHART_POINTS));
}

function basisWords(f: GroupWithForecast): string {
  if (!f.forecast) return f.noForecastReason ?? 'no forecast';
  const p = f.demandProfile;
  const demand = !p ? 'constant mean current' : p.startA === p.endA ? 'design current (constant: bare metal)' : 'design demand profile (coating breakdown)';
  return f.forecast.basis === 'survey-corrected' ? `${demand}; corrected by survey` : demand;
}

/** The forecast table's rows, in the order of the forecasts (by group label). */
function forecastRows(forecasts: readonly AssetPlan['groups'][number][], assetKind: string): ForecastRow[] {
  return forecasts.map((f) => ({
    groupId: f.group.id,
    label: f.group.label,
    installedNetKg: f.group.quantity * f.group.model.netMassKg,
    ratePerYearKg: f.forecast ? f.forecast.ratePerYearKg : null,
    basis: basisWords(f),
    renewBy: dayOrNull(f.forecast?.renewBy),
    renewByEarly: dayOrNull(f.forecast?.renewByEarly),
    renewByLate: dayOrNull(f.forecast?.renewByLate),
    endOfLife: dayOrNull(f.forecast?.endOfLife),
    renewal: f.proposal ? renewalPlanWords(renewalPlanSummary(f.proposal), assetKind) : null,
    renewalReason: f.proposal ? renewalReasonOf(f.proposal) : null,
  }));
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
  const [zones, designs, surveys, plan, catalogue] = await inSequence(
    () => ctx.em.find(ZoneSchema, { asset, archivedAt: null }, { orderBy: { sortOrder: 'asc', createdAt: 'asc' } }),
    () => ctx.em.find(DesignSchema, { asset }, { orderBy: { revision: 'desc' }, populate: ['preparedBy', 'approvedBy'], exclude: ['inputs', 'basis', 'results', 'anodeModel'] }),
    () => ctx.em.find(SurveySchema, { asset }, { orderBy: { surveyedOn: 'desc' }, limit: 20 }),
    // The plan of the asset (forecasts with their renewals and the outlook), as the planner computes it; none once
    // archived. Kept per process while the asset's stored version stands (stored-outlooks.ts).
    // The plan reads the asset again (not `asset`, read before the version): a plan kept under a version is computed from data no older than it.
    () => assetPlanFor(ctx, asset, today, async () => (await computePlans(ctx, { assetIds: [asset.id], today }))[0] ?? null),
    () => canWrite ? listCatalogue(ctx) : Promise.resolve([]),
  );
  // The plan read the dockings already (all but cancelled ones, by planned start); an archived asset has no plan.
  const dockings = plan ? plan.dockings : await ctx.em.find(DockingSchema, { asset, status: { $ne: 'cancelled' } }, { orderBy: { plannedStart: 'asc' } });
  const forecasts = plan?.groups ?? [];
  const changes = forecasts.length
    ? await ctx.em.find(AnodeGroupChangeSchema, { group: { $in: forecasts.map((f) => f.group.id) } }, { orderBy: { createdAt: 'desc' }, limit: 20, populate: ['group'] })
    : [];

  // The drawing of the asset with its groups and the latest survey's readings (one statement more).
  const drawing = await loadAssetDrawing(ctx, asset, forecasts, surveys[0] ?? null, today);

  // The chart runs half a year past the last end of life (or renew-by date), so every group's crossings are visible.
  const horizon = new Date(Math.max(today.getTime(), ...forecasts.map((f) => (f.forecast?.endOfLife ?? f.forecast?.renewBy ?? today).getTime())) + 180 * 86_400_000);
  const series: DepletionSeries[] = forecasts
    .filter((f) => f.forecast)
    .map((f) => {
      const fc = f.forecast!;
      const start = parseDateOnly(f.group.installedOn);
      return {
        label: f.group.label,
        points: fc.remainingSeries(start, horizon, chartStepMonths(start, horizon)).map((p) => ({ date: p.date, kg: p.remainingFraction * fc.installedMassKg })),
        surveys: f.surveys.map((s) => ({ date: s.date, kg: s.remainingFraction * fc.installedMassKg })),
        endKg: fc.endFraction * fc.installedMassKg,
        endOfLife: fc.endOfLife,
        renewKg: fc.renewFraction * fc.installedMassKg,
        renewBy: fc.renewBy,
      };
    });
  // The rule the renew-by dates follow, in words (the docking planner states the same sentence).
  const renewalRule = renewalRuleSentence(renewalRuleOf(ctx), asset.kind);
  const marginWords = renewalMarginSentence(renewalMarginMonths(ctx), asset.kind);
  // Anodes of different alloys on one asset work at different potentials: the more active one is
  // consumed protecting the other (common practice: one alloy per asset).
  const alloys = [...new Set(forecasts.map((f) => f.group.model.alloy))];
  const mixedAlloys = alloys.length > 1 ? alloys : null;
  return { today, asset, canWrite, zones, designs, surveys, forecasts, rows: forecastRows(forecasts, asset.kind), renewalRule, marginWords, outlook: plan?.outlook ?? null, catalogue, dockings, changes, series, mixedAlloys, drawing };
}
