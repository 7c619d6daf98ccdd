import { formatDateOnly } from '@/lib/dates/date-only';
import { forecastDateWords } from '@/lib/labels';
import { CHART_NOT_LOADED, seriesStyle, seriesSwatchMarkup, type ChartFigure } from '@/lib/figures/depletion-chart';
import { SafeHtml, html } from '@/lib/figures/markup';

export type { DepletionSeries as ChartSeries } from '@/lib/register/depletion-series';
import type { DepletionSeries as ChartSeries } from '@/lib/register/depletion-series';
export { seriesStyle } from '@/lib/figures/depletion-chart';

interface Props {
  series: ChartSeries[];
  /** The chart (depletionChartFigure), drawn from its image at `src`; null when there is nothing to draw. */
  figure: ChartFigure | null;
  src: string;
  /** What the dashed lines are called in the legend: "dockings" for a vessel, "campaigns" for a structure. */
  dockingsWord?: string;
}

/**
 * Remaining net mass of each group over time, with survey points, renew-by and end-of-life marks, dockings and
 * today, as static markup. The chart itself is an image of its own address (kept by the browser until it changes:
 * the page carries only the marks that show words on hover); the legend gives every series in words.
 */
export function depletionChartHtml({ series, figure, src, dockingsWord = 'dockings' }: Props): SafeHtml {
  if (!figure) return html`<p class="text-sm text-ink-faint">No forecast to draw yet: fit anode groups with a design or a mean current.</p>`;
  // Under the image (its white sheet covers it): what shows when the image cannot be loaded. The marks are our own
  // markup (depletionChartFigure escapes every word in them).
  const inside = html`<text x="16" y="40" font-size="12" fill="#5f6872">${CHART_NOT_LOADED}</text><image href="${src}" width="${figure.width}" height="${figure.height}"></image>${new SafeHtml(figure.marks)}`;
  const legend = series.map(
    (s, i) =>
      html`<span class="inline-flex items-center gap-1.5"><svg width="34" height="12" aria-hidden="true">${new SafeHtml(seriesSwatchMarkup(i))}</svg><strong class="font-semibold text-ink">${seriesStyle(i).letter}</strong> ${s.label}${s.renewBy ? `: ${forecastDateWords('renewBy')} ${formatDateOnly(s.renewBy, 'MMM yyyy')}` : ''}${s.endOfLife ? ` (${forecastDateWords('endOfLife')} ${formatDateOnly(s.endOfLife, 'MMM yyyy')})` : ''}</span>`,
  );
  return html`<figure class="flex flex-col gap-2"><svg viewBox="0 0 ${figure.width} ${figure.height}" role="img" aria-label="${figure.title}" class="chart w-full rounded-[3px] border border-rule bg-paper-raised">${inside}</svg><figcaption class="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">${legend}<span>Letters and markers: one per group · ○ survey estimate · ◆ ${forecastDateWords('renewBy')} · × ${forecastDateWords('endOfLife')} (utilisation factor used up) · dashed brass lines: ${dockingsWord}</span></figcaption></figure>`;
}
