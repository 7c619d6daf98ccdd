import Link from 'next/link';
import { formatDateOnly, parseDateOnly } from '@/lib/dates/date-only';
import { DOCKING_KIND_LABELS, FORECAST_DATE_LABELS, dockingKindWords, eventWords, forecastDateWords } from '@/lib/labels';
import type { PlannerDocking, PlannerNeedsDocking } from '@/lib/server/services/planner/planner-view';

interface Props {
  org: string;
  assets: { id: string; name: string; kind: string }[];
  dockings: PlannerDocking[];
  /** Groups no planned docking renews in time, marked at their renew-by date. */
  needsDocking: Pick<PlannerNeedsDocking, 'assetId' | 'renewBy' | 'group' | 'overdue'>[];
  today: Date;
  months?: number;
}

const KIND_FILL: Record<string, string> = { intermediate: '#2f7479', 'renewal-survey': '#1a474b', unplanned: '#a8322e', campaign: '#a67a2c' };
const monthStart = (d: Date) => Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 1);

/** Months across, assets down: each docking or campaign as a bar with the anode mass due; red marks the renew-by date of a group no planned docking renews in time. */
export function Timeline({ org, assets, dockings, needsDocking, today, months = 36 }: Props) {
  const rowH = 30;
  const labelW = 170;
  const monthW = 34;
  const start = monthStart(new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth() - 2, 1)));
  const end = Date.UTC(new Date(start).getUTCFullYear(), new Date(start).getUTCMonth() + months, 1);
  const width = labelW + months * monthW;
  const height = 24 + assets.length * rowH;
  const x = (iso: string | number) => labelW + ((typeof iso === 'number' ? iso : parseDateOnly(iso).getTime()) - start) / (end - start) * months * monthW;
  const monthTicks = Array.from({ length: months }, (_, i) => Date.UTC(new Date(start).getUTCFullYear(), new Date(start).getUTCMonth() + i, 1));
  return (
    <div role="region" aria-label="Docking timeline (scrolls sideways)" tabIndex={0} className="max-w-full overflow-x-auto">
      <svg width={width} height={height} role="img" aria-label="Docking timeline" className="rounded-[3px] border border-rule bg-paper-raised">
        {monthTicks.map((t) => {
          const d = new Date(t);
          return (
            <g key={t}>
              <line x1={x(t)} x2={x(t)} y1={0} y2={height} stroke={d.getUTCMonth() === 0 ? '#b9b3a7' : '#eeece6'} />
              <text x={x(t) + 3} y={14} fontSize="9.5" fill="#7b8590">
                {d.getUTCMonth() === 0 ? d.getUTCFullYear() : formatDateOnly(d, 'MMM')}
              </text>
            </g>
          );
        })}
        <line x1={x(today.getTime())} x2={x(today.getTime())} y1={18} y2={height} stroke="#1c232b" strokeWidth="1.2" />
        {assets.map((a, i) => {
          const y = 24 + i * rowH;
          return (
            <g key={a.id}>
              <line x1={0} x2={width} y1={y + rowH} y2={y + rowH} stroke="#eeece6" />
              <a href={`/o/${org}/assets/${a.id}`}>
                <text x={8} y={y + 19} fontSize="11.5" fill="#235c61">
                  {a.name.length > 24 ? `${a.name.slice(0, 23)}…` : a.name}
                </text>
              </a>
              {dockings
                .filter((d) => d.assetId === a.id && d.status !== 'cancelled')
                .map((d) => {
                  const x1 = Math.max(labelW, x(d.start));
                  const x2 = Math.max(x1 + 8, x(d.end ?? d.start) + 6);
                  if (x1 > width) return null;
                  return (
                    <Link key={d.id} href={`/o/${org}/dockings/${d.id}`}>
                      <rect x={x1} y={y + 5} width={x2 - x1} height={rowH - 10} rx={2} fill={KIND_FILL[d.kind] ?? '#46505b'} opacity={d.status === 'done' ? 0.45 : 1}>
                        <title>{`${a.name}: ${dockingKindWords(d.kind)} ${formatDateOnly(d.start)}${d.yard ? ` (${eventWords(a.kind).place} ${d.yard})` : ''}; ${Math.round(d.massDueKg)} kg of anodes due (${d.openRenewals} renewals open)`}</title>
                      </rect>
                      <text x={x2 + 3} y={y + 19} fontSize="10" fill="#1c232b">
                        {d.massDueKg > 0 ? `${Math.round(d.massDueKg)} kg` : d.status === 'done' ? 'done' : ''}
                      </text>
                    </Link>
                  );
                })}
              {needsDocking
                .filter((n) => n.assetId === a.id)
                .map((n, j) => (
                  <g key={j}>
                    <path d={`M ${Math.min(width - 8, Math.max(labelW + 4, x(n.renewBy)))} ${y + 6} l 6 9 l -6 9 l -6 -9 z`} fill="#a8322e">
                      <title>{`${n.group}: ${forecastDateWords('renewBy')} ${formatDateOnly(n.renewBy)}; ${n.overdue ? 'overdue for a docking' : 'no planned docking early enough'}`}</title>
                    </path>
                  </g>
                ))}
            </g>
          );
        })}
      </svg>
      <p className="mt-2 flex flex-wrap gap-4 text-xs text-ink-soft">
        {Object.entries(DOCKING_KIND_LABELS).map(([k, label]) => (
          <span key={k} className="inline-flex items-center gap-1.5">
            <svg width="14" height="10" aria-hidden>
              <rect width="14" height="10" rx="2" fill={KIND_FILL[k]} />
            </svg>
            {label}
          </span>
        ))}
        <span className="inline-flex items-center gap-1.5">
          <svg width="12" height="14" aria-hidden>
            <path d="M 6 0 l 6 7 l -6 7 l -6 -7 z" fill="#a8322e" />
          </svg>
          {`${FORECAST_DATE_LABELS.renewBy} of a group no planned docking renews in time`}
        </span>
        <span>Labels: net anode mass due at the docking. Faded: done.</span>
      </p>
    </div>
  );
}
