import { formatDateOnly } from '@/lib/dates/date-only';
import { forecastDateWords } from '@/lib/labels';

export type { DepletionSeries as ChartSeries } from '@/lib/register/depletion-series';
import type { DepletionSeries as ChartSeries } from '@/lib/register/depletion-series';

interface Props {
  series: ChartSeries[];
  dockings?: { date: Date; label: string }[];
  today: Date;
  title?: string;
}

// Line colours of our own, told apart by dash pattern as well, so the chart reads in grey print too.
const COLOURS = ['#235c61', '#a67a2c', '#6a3f8f', '#2d7244', '#a8322e', '#3b6ea5', '#7a5718', '#46505b'];
const DASHES = ['', '6 3', '2 3', '8 3 2 3'];

/** Remaining net mass of each group over time, with survey points, renew-by and end-of-life marks, dockings and today. */
export function DepletionChart({ series, dockings = [], today, title = 'Remaining net anode mass' }: Props) {
  const width = 900;
  const height = 300;
  const pad = { left: 56, right: 16, top: 16, bottom: 36 };
  const all = series.flatMap((s) => s.points);
  if (!all.length) return <p className="text-sm text-ink-faint">No forecast to draw yet: fit anode groups with a design or a mean current.</p>;
  const t0 = Math.min(...all.map((p) => p.date.getTime()));
  const t1 = Math.max(...all.map((p) => p.date.getTime()), today.getTime());
  const maxKg = Math.max(...all.map((p) => p.kg), 1);
  const x = (t: number) => pad.left + ((t - t0) / Math.max(1, t1 - t0)) * (width - pad.left - pad.right);
  const y = (kg: number) => pad.top + (1 - kg / maxKg) * (height - pad.top - pad.bottom);
  const years: number[] = [];
  for (let yr = new Date(t0).getUTCFullYear() + 1; Date.UTC(yr, 0, 1) <= t1; yr++) years.push(Date.UTC(yr, 0, 1));
  const ticks = [0, 0.25, 0.5, 0.75, 1].map((f) => f * maxKg);
  return (
    <figure className="flex flex-col gap-2">
      <svg viewBox={`0 0 ${width} ${height}`} role="img" aria-label={title} className="w-full rounded-[3px] border border-rule bg-paper-raised">
        <title>{title}</title>
        {ticks.map((kg) => (
          <g key={kg}>
            <line x1={pad.left} x2={width - pad.right} y1={y(kg)} y2={y(kg)} stroke="#eeece6" />
            <text x={pad.left - 6} y={y(kg) + 3} textAnchor="end" fontSize="10" fill="#7b8590">
              {Math.round(kg).toLocaleString('en-GB')}
            </text>
          </g>
        ))}
        <text x={12} y={pad.top + 4} fontSize="10" fill="#7b8590" transform={`rotate(-90 12 ${pad.top + 4})`} textAnchor="end">
          kg net
        </text>
        {years.map((t) => (
          <g key={t}>
            <line x1={x(t)} x2={x(t)} y1={pad.top} y2={height - pad.bottom} stroke="#eeece6" />
            <text x={x(t)} y={height - pad.bottom + 14} textAnchor="middle" fontSize="10" fill="#7b8590">
              {new Date(t).getUTCFullYear()}
            </text>
          </g>
        ))}
        {dockings.filter((d) => d.date.getTime() >= t0 && d.date.getTime() <= t1).map((d, i) => (
          <g key={i}>
            <line x1={x(d.date.getTime())} x2={x(d.date.getTime())} y1={pad.top} y2={height - pad.bottom} stroke="#a67a2c" strokeDasharray="4 3" />
            <text x={x(d.date.getTime()) + 3} y={pad.top + 10 + (i % 2) * 11} fontSize="9.5" fill="#7a5718">
              {d.label}
            </text>
          </g>
        ))}
        <line x1={x(today.getTime())} x2={x(today.getTime())} y1={pad.top} y2={height - pad.bottom} stroke="#1c232b" strokeWidth="1" />
        <text x={x(today.getTime()) + 3} y={height - pad.bottom - 4} fontSize="9.5" fill="#1c232b">
          today
        </text>
        {series.map((s, i) => {
          const colour = COLOURS[i % COLOURS.length];
          return (
            <g key={s.label}>
              <polyline fill="none" stroke={colour} strokeWidth="1.8" strokeDasharray={DASHES[Math.floor(i / COLOURS.length) % DASHES.length] || DASHES[i % DASHES.length]} points={s.points.map((p) => `${x(p.date.getTime())},${y(p.kg)}`).join(' ')} />
              {s.surveys.map((p, j) => (
                <circle key={j} cx={x(p.date.getTime())} cy={y(p.kg)} r="3.5" fill="#fff" stroke={colour} strokeWidth="1.8">
                  <title>{`${s.label}: surveyed ${formatDateOnly(p.date)}, ${Math.round(p.kg)} kg`}</title>
                </circle>
              ))}
              {s.renewBy && s.renewKg !== undefined && s.renewBy.getTime() <= t1 ? (
                <path d={`M ${x(s.renewBy.getTime())} ${y(s.renewKg) - 5} l 5 5 l -5 5 l -5 -5 z`} fill={colour}>
                  <title>{`${s.label}: ${forecastDateWords('renewBy')} ${formatDateOnly(s.renewBy)}`}</title>
                </path>
              ) : null}
              {s.endOfLife && s.endOfLife.getTime() <= t1 ? (
                <g>
                  <line x1={x(s.endOfLife.getTime()) - 4} x2={x(s.endOfLife.getTime()) + 4} y1={y(s.endKg) - 4} y2={y(s.endKg) + 4} stroke={colour} strokeWidth="2" />
                  <line x1={x(s.endOfLife.getTime()) - 4} x2={x(s.endOfLife.getTime()) + 4} y1={y(s.endKg) + 4} y2={y(s.endKg) - 4} stroke={colour} strokeWidth="2" />
                  <title>{`${s.label}: ${forecastDateWords('endOfLife')} ${formatDateOnly(s.endOfLife)} (utilisation factor used up)`}</title>
                </g>
              ) : null}
            </g>
          );
        })}
      </svg>
      <figcaption className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
        {series.map((s, i) => (
          <span key={s.label} className="inline-flex items-center gap-1.5">
            <svg width="22" height="8" aria-hidden>
              <line x1="0" x2="22" y1="4" y2="4" stroke={COLOURS[i % COLOURS.length]} strokeWidth="2" strokeDasharray={DASHES[i % DASHES.length]} />
            </svg>
            {s.label}
            {s.renewBy ? `: ${forecastDateWords('renewBy')} ${formatDateOnly(s.renewBy, 'MMM yyyy')}` : ''}
            {s.endOfLife ? ` (${forecastDateWords('endOfLife')} ${formatDateOnly(s.endOfLife, 'MMM yyyy')})` : ''}
          </span>
        ))}
        <span>○ survey estimate · ◆ {forecastDateWords('renewBy')} · × {forecastDateWords('endOfLife')} (utilisation factor used up) · dashed brass lines: dockings</span>
      </figcaption>
    </figure>
  );
}
