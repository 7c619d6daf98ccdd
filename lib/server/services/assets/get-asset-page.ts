import { createHash } from 'node:crypto';
import { AssetSchema, DockingSchema } from '@/entities';
import type { SurveyMethod, ZoneKind } from '@/entities';
import { parseDateOnly, toDateOnly } from '@/lib/dates/date-only';
import { renewalMarginSentence, renewalPlanWords, renewalRuleSentence } from '@/lib/labels';
import { requirePermission, allowed, type OrgContext } from '../../org-context';
import { builtinKey, orgKey } from '../catalogue/anode-models';
import { BUILTIN_ANODE_MODELS } from '@/lib/cp';
import { notFound } from '../../errors';
import { executePrepared } from '../../sql';
import { uuidOrNotFound } from '../../ids';
import type { GroupWithForecast } from '../forecast/group-forecasts';
import { computePlans, renewalMarginMonths, renewalRuleOf, type AssetPlan } from '../planner/compute-plans';
import { renewalPlanSummary, renewalReasonOf } from '../planner/planner-view';
import { assetPlanFor } from '../planner/stored-outlooks';
import { MAX_DRAWN_READINGS, assetDrawing, type PageReading } from './asset-drawing';

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

/** A zone as the asset page shows it and its edit form takes it. */
interface PageZone {
  id: string;
  name: string;
  kind: ZoneKind;
  areaM2: number;
  coatingCategory: string;
  coatingAgeYears: number | null;
  waterType: 'seawater' | 'brackish' | 'fresh' | 'sediment';
  climate: string;
  depthBand: string;
  drainsCurrent: 'copper-alloy' | 'stainless' | null;
}
/** An anode model as the group form offers it. */
export interface PageModel {
  key: string;
  designation: string;
  alloy: string;
  netMassKg: number;
}
type PageRow = Record<string, unknown> & {
  tw_zones: PageZone[] | null;
  tw_designs: { id: string; revision: number; title: string; status: string; preparedByName: string }[] | null;
  tw_surveys: { id: string; surveyedOn: string; method: SurveyMethod; surveyor: string | null }[] | null;
  tw_models: { id: string; designation: string; alloy: string; netMassKg: number }[] | null;
  tw_readings: PageReading[] | null;
  tw_changes: { id: string; createdAt: string; label: string; changedByEmail: string | null; changes: Record<string, [unknown, unknown]> }[] | null;
  tw_version: string | null;
  tw_day: string | null;
};

// Parameters: organisation (models), asset id, organisation. Archived assets included. The latest survey's readings
// (for the drawing) and the latest changes to the fitted groups (none once archived, as the groups have no plan then)
// come in the same statement: each statement more cost the page about half a millisecond of writing to the
// database's socket and reading its answer (measured under load, npm run bench).
const PAGE_SQL = `
select a.*,
  (select json_agg(json_build_object('id', z.id, 'name', z.name, 'kind', z.kind, 'areaM2', z.area_m2, 'coatingCategory', z.coating_category,
          'coatingAgeYears', z.coating_age_years, 'waterType', z.water_type, 'climate', z.climate, 'depthBand', z.depth_band,
          'drainsCurrent', z.drains_current) order by z.sort_order, z.created_at)
     from zone z where z.asset_id = a.id and z.archived_at is null) as tw_zones,
  (select json_agg(json_build_object('id', d.id, 'revision', d.revision, 'title', d.title, 'status', d.status, 'preparedByName', u.name)
          order by d.revision desc)
     from design d join app_user u on u.id = d.prepared_by_id where d.asset_id = a.id) as tw_designs,
  (select json_agg(json_build_object('id', s.id, 'surveyedOn', to_char(s.surveyed_on, 'YYYY-MM-DD'), 'method', s.method, 'surveyor', s.surveyor)
          order by s.surveyed_on desc, s.created_at desc, s.id desc)
     from (select * from survey where asset_id = a.id order by surveyed_on desc, created_at desc, id desc limit 20) s) as tw_surveys,
  (select json_agg(json_build_object('id', m.id, 'designation', m.designation, 'alloy', m.alloy, 'netMassKg', m.net_mass_kg) order by m.designation)
     from anode_model m where m.organisation_id = ? and m.archived_at is null) as tw_models,
  (select json_agg(json_build_object('location', r.location, 'potentialAgAgClV', r.potential_ag_ag_cl_v, 'remainingFraction', r.remaining_fraction)
          order by r.line asc nulls last, r.id asc)
     from (select * from survey_reading
            where survey_id = (select s.id from survey s where s.asset_id = a.id order by s.surveyed_on desc, s.created_at desc, s.id desc limit 1)
            order by line asc nulls last, id asc limit ${MAX_DRAWN_READINGS}) r) as tw_readings,
  (select json_agg(json_build_object('id', c.id, 'createdAt', c.created_at, 'label', c.label, 'changedByEmail', c.changed_by_email, 'changes', c.changes)
          order by c.created_at desc)
     from (select c.id, c.created_at, c.changed_by_email, c.changes, g.label from anode_group_change c join anode_group g on g.id = c.group_id
            where g.asset_id = a.id and g.organisation_id = a.organisation_id and g.removed_on is null and a.archived_at is null
            order by c.created_at desc limit 20) c) as tw_changes,
  o.version as tw_version, to_char(o.computed_on, 'YYYY-MM-DD') as tw_day
from asset a left join asset_outlook o on o.asset_id = a.id and o.organisation_id = a.organisation_id
where a.id = ? and a.organisation_id = ?`;

/**
 * Everything the asset page shows, read in one place: particulars, zones, designs, surveys, dockings,
 * the installed groups with their forecasts and the depletion curves, the latest changes, and the
 * catalogue when the member may fit anodes.
 */
export async function getAssetPage(ctx: OrgContext, assetId: string, today = new Date()) {
  requirePermission(ctx, 'org:read');
  uuidOrNotFound(assetId, 'Asset');
  // Zones, designs, surveys, the stored plan version and (for a member who may fit anodes) the organisation's
  // catalogue come with the asset in one plain statement: the page reads them only to show them, and building
  // five ORM queries cost more than the page's rendering (measured). The version is read before the plan is
  // computed (assetPlanFor), as it must be.
  const [row] = await executePrepared<PageRow>(ctx.em, 'tw_asset_page', PAGE_SQL, [ctx.organisation.id, assetId, ctx.organisation.id]);
  if (!row) throw notFound('Asset');
  const key = keptPageKey(ctx, row, today);
  const kept = key ? keptPages.get(key.slot) : undefined;
  if (key && kept && kept.digest === key.digest) {
    keptPages.delete(key.slot);
    keptPages.set(key.slot, kept);
    return kept.page;
  }
  const page = await assetPageOf(ctx, row, today);
  if (key) {
    // The asset's page for this access replaces the one kept before it (older data is never asked for again).
    keptPages.delete(key.slot);
    keptPages.set(key.slot, { digest: key.digest, page });
    if (keptPages.size > KEPT_PAGES) keptPages.delete(keptPages.keys().next().value!);
  }
  return page;
}

export type AssetPage = Awaited<ReturnType<typeof assetPageOf>>;

// ---------- the page kept per process while what it was built from stands ----------

const KEPT_PAGES = 64;
/** One page per asset and access (may the member change the register or not), with the digest it was built under. */
const keptPages = new Map<string, { digest: string; page: AssetPage }>();

/** Drops every kept page (tests: to compare a kept page with one built afresh). */
export function forgetKeptPages() {
  keptPages.clear();
}

/**
 * Where a page is kept (the asset, for members who may change the register or not: the only difference the page
 * makes between members) and the digest of everything it is built from. The statement's row holds the asset, its
 * zones, designs, surveys, the latest readings and changes, the catalogue, and the stored plan's version, which
 * the unit of work renews with every change that feeds the plan (stored-outlooks.ts); beside it the organisation's
 * renewal settings and the day. None (built afresh, not kept) for an archived asset (its dockings are read apart
 * from the plan) or one whose stored plan is not of the day.
 */
function keptPageKey(ctx: OrgContext, row: PageRow, today: Date): { slot: string; digest: string } | null {
  if (!row.tw_version || row.tw_day !== toDateOnly(today) || row.archived_at) return null;
  const canWrite = allowed(ctx, 'asset:write');
  return {
    slot: `${ctx.organisation.id} ${String(row.id)} ${canWrite}`,
    digest: createHash('sha256')
      .update(JSON.stringify([renewalRuleOf(ctx), renewalMarginMonths(ctx), today.getTime(), row]))
      .digest('base64'),
  };
}

async function assetPageOf(ctx: OrgContext, row: PageRow, today: Date) {
  const { tw_zones, tw_designs, tw_surveys, tw_models, tw_readings, tw_changes, tw_version, tw_day, ...assetRow } = row;
  const asset = ctx.em.map(AssetSchema, assetRow);
  const canWrite = allowed(ctx, 'asset:write') && !asset.archivedAt;
  const zones = (tw_zones ?? []).map((z) => ({ ...z, coatingAgeYears: z.coatingAgeYears ?? 0 }));
  const designs = (tw_designs ?? []).map(({ preparedByName, ...d }) => ({ ...d, preparedBy: { name: preparedByName } }));
  const surveys = tw_surveys ?? [];
  const catalogue: PageModel[] = canWrite
    ? [
        ...BUILTIN_ANODE_MODELS.map((m) => ({ key: builtinKey(m.id), designation: m.designation, alloy: m.alloy, netMassKg: m.netMassKg })),
        ...(tw_models ?? []).map((m) => ({ key: orgKey(m.id), designation: m.designation, alloy: m.alloy, netMassKg: m.netMassKg })),
      ]
    : [];
  // The plan of the asset (forecasts with their renewals and the outlook), as the planner computes it; none once
  // archived. Kept per process while the asset's stored version stands (stored-outlooks.ts).
  // The plan reads the asset again (not `asset`, read before the version): a plan kept under a version is computed from data no older than it.
  const plan = await assetPlanFor(ctx, asset, today, async () => (await computePlans(ctx, { assetIds: [asset.id], today }))[0] ?? null, tw_version ? { version: tw_version, day: tw_day! } : null);
  // The plan read the dockings already (all but cancelled ones, by planned start); an archived asset has no plan.
  const dockings = plan ? plan.dockings : await ctx.em.find(DockingSchema, { asset, status: { $ne: 'cancelled' } }, { orderBy: { plannedStart: 'asc' } });
  const forecasts = plan?.groups ?? [];
  const changes = (tw_changes ?? []).map(({ label, createdAt, ...c }) => ({ ...c, createdAt: new Date(createdAt), group: { label } }));

  // The drawing of the asset with its groups and the latest survey's readings (read above).
  const drawing = assetDrawing(asset, forecasts, tw_readings ?? [], today);

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
