import { drawingImageMarkup } from '@/components/drawings/drawing-svg';
import { formatDateOnly, parseDateOnly, todayDateOnly } from '@/lib/dates/date-only';
import { depletionChartFigure, type ChartFigure, type ChartInput } from '@/lib/figures/depletion-chart';
import { markupVersion } from '@/lib/figures/markup';
import { eventWords } from '@/lib/labels';
import type { getAssetPage } from './get-asset-page';
import { keptWith } from '../../kept-with';

/*
 * The asset page's figures (the drawing's views and the depletion chart) as standalone SVG documents, each with
 * its version. The page draws them as images from their own address (figureHref) with the version in it, so a
 * browser keeps each until it changes and the page's markup carries only the links and marks over them; the
 * figure's route (app/api/orgs/[org]/assets/[assetId]/figures/[figure]) builds the same documents from the same data.
 */

export type AssetPageData = Awaited<ReturnType<typeof getAssetPage>>;

export interface AssetFigure {
  /** The view's id ('starboard', 'port', 'plan') or 'chart'. */
  name: string;
  document: string;
  version: string;
}

/** The figure names a route accepts: the drawing's views and the chart. */
export const FIGURE_NAMES = ['starboard', 'port', 'plan', 'chart'] as const;
export type FigureName = (typeof FIGURE_NAMES)[number];

/** What the chart draws: the groups' curves, the dockings (or diving campaigns) not cancelled, today. */
export function chartInputOf(page: Pick<AssetPageData, 'series' | 'today' | 'dockings' | 'asset'>): ChartInput {
  const words = eventWords(page.asset.kind);
  return {
    series: page.series,
    today: page.today,
    dockings: page.dockings.map((d) => {
      const day = d.actualStart ?? d.plannedStart;
      return { date: parseDateOnly(day), label: `${words.Event} ${formatDateOnly(day)}${d.status === 'done' ? ' (done)' : ''}` };
    }),
  };
}

/** The page's figures with their versions: built once per page kept (getAssetPage keeps a page while its data stand). */
export function assetFigures(page: Pick<AssetPageData, 'series' | 'today' | 'dockings' | 'asset' | 'drawing'>): { views: AssetFigure[]; chart: ChartFigure | null } {
  return keptWith(page, 'figures', () => buildFigures(page));
}

function buildFigures(page: Pick<AssetPageData, 'series' | 'today' | 'dockings' | 'asset' | 'drawing'>): { views: AssetFigure[]; chart: ChartFigure | null } {
  const views = (page.drawing.drawing?.views ?? []).map((view) => {
    const document = drawingImageMarkup(view);
    return { name: view.id, document, version: markupVersion(document) };
  });
  return { views, chart: depletionChartFigure(chartInputOf(page)) };
}

/**
 * The day the asset page and its figures are drawn for: today at 00:00 UTC (the forecasts' dates are days). The
 * same all day, so a figure keeps its version and the browser's copy from morning to evening unless the asset changes.
 */
export function figureDay(now: Date = new Date()): Date {
  return parseDateOnly(todayDateOnly(now));
}

/** A figure's address, with its version (a new version is a new address: the browser's copy never goes stale). */
export function figureHref(org: string, assetId: string, name: string, version: string): string {
  return `/api/orgs/${encodeURIComponent(org)}/assets/${encodeURIComponent(assetId)}/figures/${encodeURIComponent(name)}?v=${encodeURIComponent(version)}`;
}
