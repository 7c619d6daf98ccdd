import { formatDateOnly } from '@/lib/dates/date-only';
import { forecastDateWords } from '@/lib/labels';
import type { DepletionSeries } from '@/lib/register/depletion-series';
import { escapeMarkup, markupVersion, svgDocument } from './markup';

/*
 * The depletion chart of an asset as a figure: the drawing as a standalone SVG document (served at its own
 * address, components/register/depletion-chart.tsx draws it as an image) and the marks the page lays over it,
 * each with its words as a tooltip. Pure: the page and the figure's route build the same document from the same data.
 */

export interface ChartInput {
  series: DepletionSeries[];
  dockings?: { date: Date; label: string }[];
  today: Date;
  title?: string;
}

export interface ChartFigure {
  width: number;
  height: number;
  title: string;
  /** The whole chart as an SVG document. */
  document: string;
  /** Its version (markupVersion of the document): part of its address. */
  version: string;
  /** Transparent marks over the survey points, renew-by and end-of-life marks, each with a <title>. */
  marks: string;
}

/** Said where the chart's image did not load (no signal, session ended): the table and the legend still say it all. */
export const CHART_NOT_LOADED = 'The chart did not load: the legend and the table below give every date in words.';

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
  return { colour: COLOURS[i % COLOURS.length]!, dash: DASHES[i % DASHES.length]!, marker: MARKERS[i % MARKERS.length]!, letter };
}

/** A series' point marker, centred on (x, y), drawn in its colour on white so it reads over the grid. */
export function markerMarkup(kind: SeriesMarker, x: number, y: number, colour: string): string {
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

/** The legend's swatch of the i-th series (line, dash and marker) as markup for a 34 × 12 <svg>. */
export function seriesSwatchMarkup(i: number): string {
  const s = seriesStyle(i);
  return `<line x1="0" x2="34" y1="6" y2="6" stroke="${s.colour}" stroke-width="2"${s.dash ? ` stroke-dasharray="${s.dash}"` : ''} />${markerMarkup(s.marker, 17, 6, s.colour)}`;
}

/** Remaining net mass of each group over time, with survey points, renew-by and end-of-life marks, dockings and today; null with nothing to draw. */
export function depletionChartFigure({ series, dockings = [], today, title = 'Remaining net anode mass' }: ChartInput): ChartFigure | null {
  const width = 900;
  const height = 300;
  const pad = { left: 56, right: 16, top: 16, bottom: 36 };
  const all = series.flatMap((s) => s.points);
  if (!all.length) return null;
  const t0 = Math.min(...all.map((p) => p.date.getTime()));
  const t1 = Math.max(...all.map((p) => p.date.getTime()), today.getTime());
  const maxKg = Math.max(...all.map((p) => p.kg), 1);
  // Coordinates to a tenth of a drawing unit (far below a pixel): fifteen-digit floats tripled the chart's size.
  const tenth = (v: number) => Math.round(v * 10) / 10;
  const x = (t: number) => tenth(pad.left + ((t - t0) / Math.max(1, t1 - t0)) * (width - pad.left - pad.right));
  const y = (kg: number) => tenth(pad.top + (1 - kg / maxKg) * (height - pad.top - pad.bottom));
  const years: number[] = [];
  for (let yr = new Date(t0).getUTCFullYear() + 1; Date.UTC(yr, 0, 1) <= t1; yr++) years.push(Date.UTC(yr, 0, 1));
  const ticks = [0, 0.25, 0.5, 0.75, 1].map((f) => f * maxKg);
  // Every text is escaped.
  let svg = `<title>${escapeMarkup(title)}</title><rect width="${width}" height="${height}" fill="#ffffff" />`;
  let marks = '';
  const mark = (cx: number, cy: number, words: string) => {
    marks += `<circle cx="${cx}" cy="${cy}" r="6" fill="transparent" class="chart-mark"><title>${escapeMarkup(words)}</title></circle>`;
  };
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
    const at = n ? [0.2, 0.45, 0.7, 0.95].map((f) => s.points[Math.min(n - 1, Math.floor(n * ((f + (i % 4) * 0.05) % 1)))]!) : [];
    svg += `<g data-series="${letter}" data-dash="${dash}" data-marker="${marker}">`;
    svg += `<polyline fill="none" stroke="${colour}" stroke-width="1.8"${dash ? ` stroke-dasharray="${dash}"` : ''} points="${s.points.map((p) => `${x(p.date.getTime())},${y(p.kg)}`).join(' ')}" />`;
    for (const p of at) svg += markerMarkup(marker, x(p.date.getTime()), y(p.kg), colour);
    if (at[0]) svg += `<text x="${x(at[0].date.getTime()) + 6}" y="${y(at[0].kg) - 6}" font-size="10" font-weight="700" fill="#1c232b" stroke="#ffffff" stroke-width="2.5" paint-order="stroke">${letter}</text>`;
    for (const p of s.surveys) {
      const words = `${s.label}: surveyed ${formatDateOnly(p.date)}, ${Math.round(p.kg)} kg`;
      svg += `<circle cx="${x(p.date.getTime())}" cy="${y(p.kg)}" r="3.5" fill="#fff" stroke="${colour}" stroke-width="1.8"><title>${escapeMarkup(words)}</title></circle>`;
      mark(x(p.date.getTime()), y(p.kg), words);
    }
    if (s.renewBy && s.renewKg !== undefined && s.renewBy.getTime() <= t1) {
      const words = `${s.label}: ${forecastDateWords('renewBy')} ${formatDateOnly(s.renewBy)}`;
      svg += `<path d="M ${x(s.renewBy.getTime())} ${y(s.renewKg) - 5} l 5 5 l -5 5 l -5 -5 z" fill="${colour}"><title>${escapeMarkup(words)}</title></path>`;
      mark(x(s.renewBy.getTime()), y(s.renewKg), words);
    }
    if (s.endOfLife && s.endOfLife.getTime() <= t1) {
      const ex = x(s.endOfLife.getTime());
      const ey = y(s.endKg);
      const words = `${s.label}: ${forecastDateWords('endOfLife')} ${formatDateOnly(s.endOfLife)} (utilisation factor used up)`;
      svg += `<g><line x1="${ex - 4}" x2="${ex + 4}" y1="${ey - 4}" y2="${ey + 4}" stroke="${colour}" stroke-width="2" />`;
      svg += `<line x1="${ex - 4}" x2="${ex + 4}" y1="${ey + 4}" y2="${ey - 4}" stroke="${colour}" stroke-width="2" />`;
      svg += `<title>${escapeMarkup(words)}</title></g>`;
      mark(ex, ey, words);
    }
    svg += '</g>';
  });
  const document = svgDocument(width, height, svg);
  return { width, height, title, document, version: markupVersion(document), marks };
}
