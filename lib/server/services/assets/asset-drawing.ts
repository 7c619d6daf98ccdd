import type { Asset, Survey } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';
import { buildAssetDrawing, type AssetDrawingResult } from '@/lib/drawings/asset-drawing';
import type { DrawnGroup, DrawnReading } from '@/lib/drawings/hull-drawing';
import { parsePosition } from '@/lib/drawings/parse-position';
import { positionOf } from '@/lib/drawings/position-of';
import { POTENTIAL_STATUS_LABELS, inSentence } from '@/lib/labels';
import { surveyCriteriaOf } from '@/lib/register/protected-metal';
import { classifyPotential, formatVolts } from '@/lib/surveys/criteria';
import type { GroupWithForecast } from '../forecast/group-forecasts';

/** Readings a drawing marks at most (the latest survey's, in line order). */
export const MAX_DRAWN_READINGS = 200;

/** The groups as the drawing needs them: position as data and the forecast remaining fraction on the day. */
export function drawnGroups(forecasts: readonly GroupWithForecast[], today: Date, kind?: 'vessel' | 'structure'): DrawnGroup[] {
  return forecasts.map((f) => {
    const surveyed = f.surveys.length ? f.surveys[f.surveys.length - 1]!.remainingFraction : null;
    return {
      id: f.group.id,
      label: f.group.label,
      quantity: f.group.quantity,
      position: positionOf(f.group, kind),
      remainingFraction: f.forecast ? Math.max(0, Math.min(1, f.forecast.remainingFractionAt(today))) : surveyed,
    };
  });
}

/** A reading's words on the drawing: the potential and its verdict against the asset's criteria, or the mass left. */
export function readingWords(asset: Pick<Asset, 'kind' | 'hullMaterial' | 'anaerobic' | 'highStrengthSteel'>, r: { potentialAgAgClV?: number | null; remainingFraction?: number | null }): string | null {
  if (r.potentialAgAgClV !== null && r.potentialAgAgClV !== undefined) {
    const verdict = classifyPotential({ potentialAgAgClV: r.potentialAgAgClV, ...surveyCriteriaOf(asset) });
    return `${formatVolts(r.potentialAgAgClV)} V, ${inSentence(POTENTIAL_STATUS_LABELS[verdict.status])}`;
  }
  if (r.remainingFraction !== null && r.remainingFraction !== undefined) return `${Math.round(r.remainingFraction * 100)} % left (surveyed)`;
  return null;
}

/** A reading of the latest survey as the drawing takes it (read with the asset page's statement). */
export interface PageReading {
  location: string;
  potentialAgAgClV: number | null;
  remainingFraction: number | null;
}

/**
 * The asset's drawing from what the asset page read (its groups with their forecasts, the readings of its latest
 * survey in line order, at most MAX_DRAWN_READINGS): no statement of its own.
 */
export function assetDrawing(asset: Asset, forecasts: readonly GroupWithForecast[], rows: readonly PageReading[], today: Date): AssetDrawingResult {
  const readings: DrawnReading[] = rows.flatMap((r) => {
    const words = readingWords(asset, r);
    return words ? [{ location: r.location, position: parsePosition(r.location, asset.kind), words }] : [];
  });
  return buildAssetDrawing(asset, drawnGroups(forecasts, today, asset.kind), readings);
}

/**
 * The asset's drawing for a caller that has not read the readings (the calculation note): the groups given, plus one
 * statement, the readings of the latest survey. Constant in the number of groups.
 */
export async function loadAssetDrawing(ctx: OrgContext, asset: Asset, forecasts: readonly GroupWithForecast[], latestSurvey: Pick<Survey, 'id'> | null, today: Date): Promise<AssetDrawingResult> {
  requirePermission(ctx, 'org:read');
  const rows = latestSurvey
    ? await ctx.em.execute<PageReading[]>(
        `select location, potential_ag_ag_cl_v as "potentialAgAgClV", remaining_fraction as "remainingFraction"
           from survey_reading where survey_id = ? order by line asc nulls last, id asc limit ?`,
        [latestSurvey.id, MAX_DRAWN_READINGS],
      )
    : [];
  return assetDrawing(asset, forecasts, rows, today);
}
