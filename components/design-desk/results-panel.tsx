'use client';
import { INFORMATION_NOTICE_CODES } from '@/lib/design/build-design-input';
import { CRITERION_LABELS, BASIS_FLAG_WORDS, RESISTANCE_FORMULA_LABELS as FORMULA_LABELS, versusElectrode } from '@/lib/labels';
import { fmt, fmtInt, fmtSig } from '@/lib/format';
import { Panel, StatusTag } from '@/components/ui/panel';
import type { DeskComputed } from '@/lib/client/desk-calculation';
import { TableFrame } from '@/components/ui/table-frame';


/** Every criterion with the governing one named, then demand, per-anode figures, distribution and warnings. */
export function ResultsPanel({ computed, stale }: { computed: DeskComputed | null; stale: boolean }) {
  if (!computed) return <Panel title="Results"><p className="text-sm text-ink-faint">Enter the job to see results.</p></Panel>;
  const { result, error, notices } = computed;
  return (
    <Panel title={<span>Results {stale ? <span className="text-xs font-normal text-ink-faint">(updating…)</span> : null}</span>}>
      {error ? (
        <p role="alert" className="mb-3 rounded-[3px] border border-state-action/40 bg-state-actionbg px-3 py-2 text-sm text-state-action">
          These inputs cannot be sized: {error.message} <span className="text-xs">(field: {error.field})</span>
        </p>
      ) : null}
      {result ? (
        <div className={`flex flex-col gap-4 ${stale ? 'opacity-70' : ''}`} data-testid="design-results">
          <section aria-label="Anode count">
            <div className="flex items-baseline gap-3">
              <p className="text-3xl font-semibold text-tide-700" data-testid="anode-count">
                {result.anodesToFit}
              </p>
              <p className="text-sm text-ink-soft">
                anodes of {computed.model?.designation ?? 'a model not recorded with this revision'} to fit; at least {result.anodeCount} by <strong className="text-ink">{CRITERION_LABELS[result.governingCriterion]}</strong>, which governs
              </p>
            </div>
            <TableFrame label="Count by criterion">
            <table className="mt-2 w-full text-sm" aria-label="Count by criterion">
              <thead className="text-xs text-ink-soft">
                <tr className="border-b border-rule">
                  <th className="py-1 text-left font-medium">Criterion</th>
                  <th className="py-1 text-right font-medium">Exact</th>
                  <th className="py-1 text-right font-medium">Minimum</th>
                  <th className="py-1 text-right font-medium"><span className="sr-only">Governs the count</span></th>
                </tr>
              </thead>
              <tbody>
                {(
                  [
                    ['mass', 'N·m ≥ M'],
                    ['initialCurrent', 'N·Iₐᵢ ≥ Ici'],
                    ['finalCurrent', 'N·Iₐf ≥ Icf'],
                  ] as const
                ).map(([key, relation]) => {
                  const criterion = key === 'mass' ? 'mass' : key === 'initialCurrent' ? 'initial-current' : 'final-current';
                  const governing = result.governingCriterion === criterion;
                  return (
                    <tr key={key} className={`border-b border-rule last:border-0 ${governing ? 'bg-tide-50 font-semibold' : ''}`}>
                      <td className="py-1">
                        {CRITERION_LABELS[criterion]} <span className="text-2xs font-normal text-ink-faint">{relation}</span>
                      </td>
                      <td className="num py-1">{fmt(result.exactCountBy[key], 2)}</td>
                      <td className="num py-1">{result.countBy[key]}</td>
                      <td className="py-1 pl-2 text-right">{governing ? <StatusTag tone="neutral">governs</StatusTag> : null}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
            </TableFrame>
          </section>

          <section aria-label="Key figures" className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm md:grid-cols-3">
            <Figure label="Required net mass M" value={`${fmt(result.requiredNetMassKg, 1)} kg`} />
            <Figure label="Installed net mass" value={`${fmt(result.installedNetMassKg, 1)} kg`} />
            <Figure label="Installed gross mass" value={result.installedGrossMassKg !== null ? `${fmt(result.installedGrossMassKg, 1)} kg` : '–'} />
            <Figure label="Achieved life" value={`${fmt(result.achievedLifeYears, 1)} years`} />
            <Figure label="Driving voltage" value={`${fmt(result.drivingVoltageV, 3)} V`} />
            <Figure label="Protective potential" value={`${fmt(result.protectivePotentialV, 2)} ${versusElectrode('Ag/AgCl')}`} />
          </section>

          <section aria-label="Current demand">
            <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-soft">Current demand (Ic = Ac · fc · ic)</h3>
            <TableFrame label="Current demand">
            <table className="w-full text-sm">
              <thead className="text-xs text-ink-soft">
                <tr className="border-b border-rule">
                  <th className="py-1 text-left font-medium">Zone</th>
                  <th className="py-1 text-right font-medium">Area m²</th>
                  <th className="py-1 text-right font-medium">Initial A</th>
                  <th className="py-1 text-right font-medium">Mean A</th>
                  <th className="py-1 text-right font-medium">Final A</th>
                  <th className="py-1 text-right font-medium">Anodes</th>
                </tr>
              </thead>
              <tbody>
                {result.surfaces.map((s, i) => (
                  <tr key={i} className="border-b border-rule">
                    <td className="py-1">
                      {s.name}
                      <span className="block text-2xs text-ink-faint">
                        fc {fmt(s.breakdown.initial, 3)} / {fmt(s.breakdown.mean, 3)} / {fmt(s.breakdown.final, 3)}
                      </span>
                    </td>
                    <td className="num py-1">{fmt(s.areaM2, 1)}</td>
                    <td className="num py-1">{fmtSig(s.initialA)}</td>
                    <td className="num py-1">{fmtSig(s.meanA)}</td>
                    <td className="num py-1">{fmtSig(s.finalA)}</td>
                    <td className="num py-1">{result.distribution.surfaces[i]?.count ?? '–'}</td>
                  </tr>
                ))}
                <tr className="font-semibold">
                  <td className="py-1">Total</td>
                  <td className="num py-1">{fmt(result.surfaces.reduce((t, s) => t + s.areaM2, 0), 1)}</td>
                  <td className="num py-1">{fmtSig(result.current.initialA)}</td>
                  <td className="num py-1">{fmtSig(result.current.meanA)}</td>
                  <td className="num py-1">{fmtSig(result.current.finalA)}</td>
                  <td className="num py-1">{result.distribution.distributedCount}</td>
                </tr>
              </tbody>
            </table>
            </TableFrame>
            {result.anodesToFit > result.anodeCount ? (
              <p className="mt-1 text-xs text-ink-soft">
                Sharing the minimum of {result.anodeCount} in proportion to each zone&apos;s {result.distribution.basis} demand and rounding up per zone gives {result.anodesToFit} to fit.
              </p>
            ) : null}
            {result.distribution.surfaces.some((s) => s.anodesAllowed === false) ? (
              <p className="mt-1 text-xs text-ink-soft">No anodes go in the mud: its demand is carried by the anodes in the water.</p>
            ) : null}
          </section>

          <section aria-label="Per anode">
            <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-soft">Per anode</h3>
            <TableFrame label="Per anode">
            <table className="w-full text-sm">
              <thead className="text-xs text-ink-soft">
                <tr className="border-b border-rule">
                  <th className="py-1 text-left font-medium"><span className="sr-only">When</span></th>
                  <th className="py-1 text-right font-medium">Resistance Ω</th>
                  <th className="py-1 text-right font-medium">Output A</th>
                  <th className="py-1 text-left font-medium pl-3">Formula</th>
                </tr>
              </thead>
              <tbody>
                <tr className="border-b border-rule">
                  <td className="py-1">Initial</td>
                  <td className="num py-1">{fmtSig(result.perAnode.initialResistanceOhm, 4)}</td>
                  <td className="num py-1">{fmtSig(result.perAnode.initialOutputA, 3)}</td>
                  <td className="py-1 pl-3 text-xs text-ink-soft">{FORMULA_LABELS[result.perAnode.initialFormula] ?? result.perAnode.initialFormula}</td>
                </tr>
                <tr>
                  <td className="py-1">End of life</td>
                  <td className="num py-1">{fmtSig(result.perAnode.finalResistanceOhm, 4)}</td>
                  <td className="num py-1">{fmtSig(result.perAnode.finalOutputA, 3)}</td>
                  <td className="py-1 pl-3 text-xs text-ink-soft">{FORMULA_LABELS[result.perAnode.finalFormula] ?? result.perAnode.finalFormula}</td>
                </tr>
              </tbody>
            </table>
            </TableFrame>
          </section>

          {computed.impressedCurrent ? (
            <section aria-label="Impressed-current system" className="rounded-[3px] border border-rule bg-paper p-3 text-sm">
              <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-soft">Impressed-current system (summary, not a design)</h3>
              <p>
                Demand {fmtSig(computed.impressedCurrent.current.initialA)} A initial, {fmtSig(computed.impressedCurrent.current.meanA)} A mean, {fmtSig(computed.impressedCurrent.current.finalA)} A final; peak at {computed.impressedCurrent.peakCondition}. Suggested rating{' '}
                <strong>{fmtInt(computed.impressedCurrent.suggestedRatingA)} A</strong> with a {fmtInt(computed.impressedCurrent.margin * 100)} % margin.
              </p>
              <p className="mt-1 text-xs text-ink-soft">{computed.impressedCurrent.note}</p>
            </section>
          ) : null}
        </div>
      ) : null}

      {notices.some((n) => INFORMATION_NOTICE_CODES.has(n.code)) ? (
        <section aria-label="How this was sized" className="mt-4">
          <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-soft">How this was sized</h3>
          <ul className="flex flex-col gap-1">
            {notices
              .filter((n) => INFORMATION_NOTICE_CODES.has(n.code))
              .map((n, i) => (
                <li key={i} className="rounded-[3px] border border-rule bg-paper px-2 py-1 text-sm text-ink" data-notice={n.code}>
                  <span className="font-semibold text-ink-soft">Note: </span>
                  {n.message}
                </li>
              ))}
          </ul>
        </section>
      ) : null}

      {result?.warnings.length || notices.some((n) => !INFORMATION_NOTICE_CODES.has(n.code)) ? (
        <section aria-label="Warnings" className="mt-4">
          <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-state-soon">Warnings</h3>
          <ul className="flex flex-col gap-1">
            {[...(result?.warnings ?? []), ...notices.filter((n) => !INFORMATION_NOTICE_CODES.has(n.code))].map((w, i) => (
              <li key={i} className="rounded-[3px] border border-state-soon/40 bg-state-soonbg px-2 py-1 text-sm text-ink" data-warning={w.code}>
                <span className="font-semibold text-state-soon">Warning: </span>
                {w.message}
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      {result ? (
        <details className="mt-4 text-xs text-ink-soft">
          <summary className="cursor-pointer">Basis: standards, editions and tables used ({result.basis.length})</summary>
          <ul className="mt-1 list-disc pl-5">
            {result.basis.map((b, i) => (
              <li key={i}>
                {b.topic}: {b.source} <span className="text-ink-faint">({BASIS_FLAG_WORDS[b.flag] ?? b.flag})</span>
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </Panel>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <p className="text-2xs uppercase tracking-wide text-ink-faint">{label}</p>
      <p className="num text-left">{value}</p>
    </div>
  );
}
