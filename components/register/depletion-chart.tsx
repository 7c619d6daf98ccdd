import { formatDateOnly } from '@/lib/dates/date-only';
import { forecastDateWords } from '@/lib/labels';
import { escapeMarkup } from '@/components/drawings/drawing-svg';

export type { DepletionSeries as ChartSeries } from '@/lib/register/depletion-series';
import type { DepletionSeries as ChartSeries } from '@/lib/register/depletion-series';

interface Props {
  series: ChartSeries[];
  dockings?: { date: Date; label: string }[];
  /** What the dashed lines are called in the legend: "dockings" for a vessel, "campaigns" for a structure. */
  dockingsWord?: string;
  today: Date;
  title?: string;
}

// Line colours of our own; each series also has its own dash pattern, its own point marker and a letter drawn on
// the line and in the legend, so no two series differ by colour alone and the chart reads in grey print.
const COLOURS = ['#235c61', '#a67a2c', '#6a3f8f', '#2d7244', '#a8322e', '#3b6ea5', '#7a5718', '#46505b'];
const DASHES = ['', '7 3', '2 3', '9 3 2 3', '4 4', '12 4', '2 2 6 2', '9 2 2 2 2 2'];
// No circle, diamond or cross among them: those mark a survey, the renew-by date and the end of life.
export type SeriesMarker = 'square' | 'triangle' | 'inverted' | 'bar' | 'chevron';
const MARKERS: readonly SeriesMarker[] = ['square', 'triangle', 'inverted', 'bar', 'chevron'];

/** The look of the i-th series: colour, dash pattern, marker and letter (A, B, …, Z, AA, …); no two alike for the first 40. */
export function seriesStyle(i: number): { colour: string; dash: string; marker: SeriesMarker; letter: string } {
  const letter = i < 26 ? String.fromCharCode(65 + i) : `${String.fromCharCode(65 + Math.floor(i / 26) - 1)}${String.fromCharCode(65 + (i % 26))}`;
  return { colour: COLOURS[i % COLOURS.length], dash: DASHES[i % DASHES.length], marker: MARKERS[i % MARKERS.length], letter };
}

/** A series' point marker, centred on (x, y), drawn in its colour on white so it reads over the grid. */
function markerMarkup(kind: SeriesMarker, x: number, y: number, colour: string): string {
  const p = `fill="${colour}" stroke="#ffffff" stroke-width="1"`;
  switch (kind) {
    case 'square':
      return `<rect x="${x - 3.5}" y="${y - 3.5}" width="7" height="7" ${p} />`;
    case 'triangle':
      return `<path d="M ${x} ${y - 4.5} L ${x + 4.5} ${y + 3.5} L ${x - 4.5} ${y + 3.5} Z" ${p} />`;
    case 'inverted':
      return `<path d="M ${x} ${y + 4.5} L ${x + 4.5} ${y - 3.5} L ${x - 4.5} ${y - 3.5} Z" ${p} />`;
    case 'bar':
      return `<rect x="${x - 1.75}" y="${y - 5}" width="3.5" height="10" ${p} />`;
    default:
      return `<path d="M ${x - 4.5} ${y - 1} L ${x} ${y - 5} L ${x + 4.5} ${y - 1} L ${x + 4.5} ${y + 3} L ${x} ${y - 1} L ${x - 4.5} ${y + 3} Z" ${p} />`;
  }
}

/** Remaining net mass of each group over time, with survey points, renew-by and end-of-life marks, dockings and today. */
export function DepletionChart({ series, dockings = [], dockingsWord = 'dockings', today, title = 'Remaining net anode mass' }: Props) {
  const width = 900;
  const height = 300;
  const pad = { left: 56, right: 16, top: 16, bottom: 36 };
  const all = series.flatMap((s) => s.points);
  if (!all.length) return <p className="text-sm text-ink-faint">No forecast to draw yet: fit anode groups with a design or a mean current.</p>;
  const t0 = Math.min(...all.map((p) => p.date.getTime()));
  const t1 = Math.max(...all.map((p) => p.date.getTime()), today.getTime());
  const maxKg = Math.max(...all.map((p) => p.kg), 1);
  // Coordinates to a tenth of a drawing unit (far below a pixel): fifteen-digit floats tripled the page's size.
  const tenth = (v: number) => Math.round(v * 10) / 10;
  const x = (t: number) => tenth(pad.left + ((t - t0) / Math.max(1, t1 - t0)) * (width - pad.left - pad.right));
  const y = (kg: number) => tenth(pad.top + (1 - kg / maxKg) * (height - pad.top - pad.bottom));
  const years: number[] = [];
  for (let yr = new Date(t0).getUTCFullYear() + 1; Date.UTC(yr, 0, 1) <= t1; yr++) years.push(Date.UTC(yr, 0, 1));
  const ticks = [0, 0.25, 0.5, 0.75, 1].map((f) => f * maxKg);
  // The chart's content as one string of SVG markup, not React elements: a few hundred elements walked twice per
  // request (HTML and RSC payload) were a measurable part of the asset page's cost. Every text is escaped.
  let svg = `<title>${escapeMarkup(title)}</title>`;
  for (const kg of ticks) {
    svg += `<g><line x1="${pad.left}" x2="${width - pad.right}" y1="${y(kg)}" y2="${y(kg)}" stroke="#eeece6" />`;
    svg += `<text x="${pad.left - 6}" y="${y(kg) + 3}" text-anchor="end" font-size="10" fill="#5f6872">${escapeMarkup(Math.round(kg).toLocaleString('en-GB'))}</text></g>`;
  }
  svg += `<text x="12" y="${pad.top + 4}" font-size="10" fill="#5f6872" transform="rotate(-90 12 ${pad.top + 4})" text-anchor="end">kg net</text>`;
  for (const t of years) {
    svg += `<g><line x1="${x(t)}" x2="${x(t)}" y1="${pad.top}" y2="${height - pad.bottom}" stroke="#eeece6" />`;
    svg += `<text x="${x(t)}" y="${height - pad.bottom + 14}" text-anchor="middle" font-size="10" fill="#5f6872">${new Date(t).getUTCFullYear()}</text></g>`;
  }
  dockings
    .filter((d) => d.date.getTime() >= t0 && d.date.getTime() <= t1)
    .forEach((d, i) => {
      const dx = x(d.date.getTime());
      svg += `<g><line x1="${dx}" x2="${dx}" y1="${pad.top}" y2="${height - pad.bottom}" stroke="#a67a2c" stroke-dasharray="4 3" />`;
      svg += `<text x="${dx + 3}" y="${pad.top + 10 + (i % 2) * 11}" font-size="9.5" fill="#7a5718">${escapeMarkup(d.label)}</text></g>`;
    });
  const tx = x(today.getTime());
  svg += `<line x1="${tx}" x2="${tx}" y1="${pad.top}" y2="${height - pad.bottom}" stroke="#1c232b" stroke-width="1" />`;
  svg += `<text x="${tx + 3}" y="${height - pad.bottom - 4}" font-size="9.5" fill="#1c232b">today</text>`;
  series.forEach((s, i) => {
    const { colour, dash, marker, letter } = seriesStyle(i);
    // Markers at a few points along the line, offset per series so neighbours do not sit on one another;
    // the letter sits by the first of them.
    const n = s.points.length;
    const at = n ? [0.2, 0.45, 0.7, 0.95].map((f) => s.points[Math.min(n - 1, Math.floor(n * ((f + (i % 4) * 0.05) % 1)))]) : [];
    svg += `<g data-series="${letter}" data-dash="${dash}" data-marker="${marker}">`;
    svg += `<polyline fill="none" stroke="${colour}" stroke-width="1.8"${dash ? ` stroke-dasharray="${dash}"` : ''} points="${s.points.map((p) => `${x(p.date.getTime())},${y(p.kg)}`).join(' ')}" />`;
    for (const p of at) svg += markerMarkup(marker, x(p.date.getTime()), y(p.kg), colour);
    if (at[0]) svg += `<text x="${x(at[0].date.getTime()) + 6}" y="${y(at[0].kg) - 6}" font-size="10" font-weight="700" fill="#1c232b" stroke="#ffffff" stroke-width="2.5" paint-order="stroke">${letter}</text>`;
    for (const p of s.surveys) {
      svg += `<circle cx="${x(p.date.getTime())}" cy="${y(p.kg)}" r="3.5" fill="#fff" stroke="${colour}" stroke-width="1.8"><title>${escapeMarkup(`${s.label}: surveyed ${formatDateOnly(p.date)}, ${Math.round(p.kg)} kg`)}</title></circle>`;
    }
    if (s.renewBy && s.renewKg !== undefined && s.renewBy.getTime() <= t1) {
      svg += `<path d="M ${x(s.renewBy.getTime())} ${y(s.renewKg) - 5} l 5 5 l -5 5 l -5 -5 z" fill="${colour}"><title>${escapeMarkup(`${s.label}: ${forecastDateWords('renewBy')} ${formatDateOnly(s.renewBy)}`)}</title></path>`;
    }
    if (s.endOfLife && s.endOfLife.getTime() <= t1) {
      const ex = x(s.endOfLife.getTime());
      const ey = y(s.endKg);
      svg += `<g><line x1="${ex - 4}" x2="${ex + 4}" y1="${ey - 4}" y2="${ey + 4}" stroke="${colour}" stroke-width="2" />`;
      svg += `<line x1="${ex - 4}" x2="${ex + 4}" y1="${ey + 4}" y2="${ey - 4}" stroke="${colour}" stroke-width="2" />`;
      svg += `<title>${escapeMarkup(`${s.label}: ${forecastDateWords('endOfLife')} ${formatDateOnly(s.endOfLife)} (utilisation factor used up)`)}</title></g>`;
    }
    svg += '</g>';
  });
  return (
    <figure className="flex flex-col gap-2">
      <svg viewBox={`0 0 ${width} ${height}`} role="img" aria-label={title} className="w-full rounded-[3px] border border-rule bg-paper-raised" dangerouslySetInnerHTML={{ __html: svg }} />
      <figcaption className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
        {series.map((s, i) => (
          <span key={s.label} className="inline-flex items-center gap-1.5">
            <svg
              width="34"
              height="12"
              aria-hidden
              dangerouslySetInnerHTML={{
                __html: `<line x1="0" x2="34" y1="6" y2="6" stroke="${seriesStyle(i).colour}" stroke-width="2"${seriesStyle(i).dash ? ` stroke-dasharray="${seriesStyle(i).dash}"` : ''} />${markerMarkup(seriesStyle(i).marker, 17, 6, seriesStyle(i).colour)}`,
              }}
            />
            <strong className="font-semibold text-ink">{seriesStyle(i).letter}</strong> {s.label}
            {s.renewBy ? `: ${forecastDateWords('renewBy')} ${formatDateOnly(s.renewBy, 'MMM yyyy')}` : ''}
            {s.endOfLife ? ` (${forecastDateWords('endOfLife')} ${formatDateOnly(s.endOfLife, 'MMM yyyy')})` : ''}
          </span>
        ))}
        <span>Letters and markers: one per group · ○ survey estimate · ◆ {forecastDateWords('renewBy')} · × {forecastDateWords('endOfLife')} (utilisation factor used up) · dashed brass lines: {dockingsWord}</span>
      </figcaption>
    </figure>
  );
}
