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

/**
 * How each kind of docking is drawn: a fill pattern and a letter as well as a colour, so the kinds read in grey
 * print and for anyone who does not tell the colours apart. The colours are tide and ink shades, never a status
 * colour (red, amber, green, blue, purple mean one state each: lib/status/palette.ts).
 */
export const DOCKING_KIND_STYLES: Readonly<Record<string, { label: string; letter: string; pattern: 'solid' | 'diagonal' | 'cross' | 'horizontal'; colour: string }>> = {
  intermediate: { label: DOCKING_KIND_LABELS['intermediate']!, letter: 'I', pattern: 'solid', colour: '#2f7479' },
  'renewal-survey': { label: DOCKING_KIND_LABELS['renewal-survey']!, letter: 'R', pattern: 'diagonal', colour: '#1a474b' },
  unplanned: { label: DOCKING_KIND_LABELS['unplanned']!, letter: 'U', pattern: 'cross', colour: '#46505b' },
  campaign: { label: DOCKING_KIND_LABELS['campaign']!, letter: 'C', pattern: 'horizontal', colour: '#0f2b2e' },
};
const OTHER_KIND = { label: dockingKindWords(''), letter: '', pattern: 'solid', colour: '#46505b' } as const;
const fillOf = (kind: string) => {
  const style = DOCKING_KIND_STYLES[kind] ?? OTHER_KIND;
  return style.pattern === 'solid' ? style.colour : `url(#tw-kind-${style.pattern})`;
};

/** The fill patterns of the kinds, defined in the timeline's svg; the legend's swatches use the same ids. */
function KindPatterns() {
  const k = DOCKING_KIND_STYLES;
  return (
    <defs>
      <pattern id="tw-kind-diagonal" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
        <rect width="6" height="6" fill="#d3e8e8" />
        <rect width="3" height="6" fill={k['renewal-survey'].colour} />
      </pattern>
      <pattern id="tw-kind-cross" width="6" height="6" patternUnits="userSpaceOnUse">
        <rect width="6" height="6" fill="#ffffff" />
        <path d="M0 0 L6 6 M6 0 L0 6" stroke={k.unplanned.colour} strokeWidth="1.3" />
      </pattern>
      <pattern id="tw-kind-horizontal" width="4" height="4" patternUnits="userSpaceOnUse">
        <rect width="4" height="4" fill="#eef6f6" />
        <rect width="4" height="2" fill={k.campaign.colour} />
      </pattern>
    </defs>
  );
}
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
    // A figure, not an image: the asset names and the bars are links, and an image may not hold links.
    <figure aria-label="Docking timeline" className="m-0">
      {/* The chart scrolls sideways inside its own frame (never the page), from the keyboard too. */}
      <div role="region" aria-label="Docking timeline (scrolls sideways)" tabIndex={0} className="max-w-full overflow-x-auto">
      <svg width={width} height={height} className="rounded-[3px] border border-rule bg-paper-raised">
        <KindPatterns />
        {monthTicks.map((t) => {
          const d = new Date(t);
          return (
            <g key={t}>
              <line x1={x(t)} x2={x(t)} y1={0} y2={height} stroke={d.getUTCMonth() === 0 ? '#b9b3a7' : '#eeece6'} />
              <text x={x(t) + 3} y={14} fontSize="9.5" fill="#5f6872">
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
                  const style = DOCKING_KIND_STYLES[d.kind] ?? OTHER_KIND;
                  const done = d.status === 'done';
                  const name = `${a.name}: ${dockingKindWords(d.kind)} ${formatDateOnly(d.start)}${d.yard ? ` (${eventWords(a.kind).place} ${d.yard})` : ''}; ${Math.round(d.massDueKg)} kg of anodes due (${d.openRenewals} renewals open)${done ? '; done' : ''}`;
                  return (
                    <Link key={d.id} href={`/o/${org}/dockings/${d.id}`} aria-label={name}>
                      {/* Done: faded with a dashed outline and the word "done" beside it, not by the fading alone. */}
                      <rect x={x1} y={y + 5} width={x2 - x1} height={rowH - 10} rx={2} fill={fillOf(d.kind)} opacity={done ? 0.45 : 1} stroke={done ? '#1c232b' : style.colour} strokeWidth={1} strokeDasharray={done ? '3 2' : undefined} data-kind-pattern={style.pattern}>
                        <title>{name}</title>
                      </rect>
                      {style.letter && x2 - x1 >= 12 ? (
                        <text x={(x1 + x2) / 2} y={y + 18.5} textAnchor="middle" fontSize="10" fontWeight="700" fill="#1c232b" stroke="#ffffff" strokeWidth="2.5" paintOrder="stroke" aria-hidden>
                          {style.letter}
                        </text>
                      ) : null}
                      <text x={x2 + 3} y={y + 19} fontSize="10" fill="#1c232b">
                        {[d.massDueKg > 0 ? `${Math.round(d.massDueKg)} kg` : '', done ? 'done' : ''].filter(Boolean).join(' · ')}
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
      </div>
      <figcaption className="mt-2 flex flex-wrap gap-4 text-xs text-ink-soft">
        {Object.entries(DOCKING_KIND_STYLES).map(([k, style]) => (
          <span key={k} className="inline-flex items-center gap-1.5">
            <svg width="22" height="14" aria-hidden>
              <rect x="0.5" y="0.5" width="21" height="13" rx="2" fill={fillOf(k)} stroke={style.colour} />
              <text x="11" y="10.5" textAnchor="middle" fontSize="10" fontWeight="700" fill="#1c232b" stroke="#ffffff" strokeWidth="2.5" paintOrder="stroke">
                {style.letter}
              </text>
            </svg>
            {`${style.letter}: ${style.label}`}
          </span>
        ))}
        <span className="inline-flex items-center gap-1.5">
          <svg width="12" height="14" aria-hidden>
            <path d="M 6 0 l 6 7 l -6 7 l -6 -7 z" fill="#a8322e" />
          </svg>
          {`${FORECAST_DATE_LABELS.renewBy} of a group no planned docking renews in time`}
        </span>
        <span>Labels: net anode mass due at the docking; &ldquo;done&rdquo; (faded, dashed outline) once the docking is done.</span>
      </figcaption>
    </figure>
  );
}
