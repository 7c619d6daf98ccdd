'use client';
import type { OptionRow } from '@/lib/cp';
import { ALLOY_LABELS, CRITERION_LABELS } from '@/lib/design/labels';
import { fmt } from '@/lib/format';

/** The same job with every suitable model: count, mass, life, cost where priced; one click chooses it. */
export function OptionsTable({ options, chosenKey, onChoose }: { options: OptionRow[]; chosenKey: string; onChoose?: (key: string) => void }) {
  const suitable = options.filter((o): o is Extract<OptionRow, { suitable: true }> => o.suitable).sort((a, b) => a.installedNetMassKg - b.installedNetMassKg);
  const unsuitable = options.filter((o): o is Extract<OptionRow, { suitable: false }> => !o.suitable);
  return (
    <div className="flex flex-col gap-2">
      {/* Focusable so the list scrolls from the keyboard when it holds no control (read-only roles). */}
      <div className="max-h-96 overflow-auto" tabIndex={0} role="region" aria-label="Options compared, scrollable">
        <table className="w-full text-sm" aria-label="Options compared">
          <thead className="sticky top-0 bg-paper-raised text-xs text-ink-soft">
            <tr className="border-b border-rule">
              <th className="py-1 text-left font-medium">Model</th>
              <th className="py-1 text-left font-medium">Alloy</th>
              <th className="py-1 text-right font-medium">Count</th>
              <th className="py-1 text-left font-medium pl-2">Governs</th>
              <th className="py-1 text-right font-medium">Net kg</th>
              <th className="py-1 text-right font-medium">Life yr</th>
              <th className="py-1 text-right font-medium">Cost</th>
              <th className="py-1 text-right font-medium">Warnings</th>
            </tr>
          </thead>
          <tbody>
            {suitable.map((o) => (
              <tr key={o.id} className={`border-b border-rule ${o.id === chosenKey ? 'bg-tide-50 font-semibold' : ''}`}>
                <td className="py-1">
                  {onChoose && o.id !== chosenKey ? (
                    <button type="button" className="text-tide-600 underline" onClick={() => onChoose(o.id)}>
                      {o.designation}
                    </button>
                  ) : (
                    <>{o.designation}{o.id === chosenKey ? ' (chosen)' : ''}</>
                  )}
                </td>
                <td className="py-1">{ALLOY_LABELS[o.alloy]}</td>
                <td className="num py-1">{o.anodeCount}</td>
                <td className="py-1 pl-2 text-xs">{CRITERION_LABELS[o.governingCriterion]}</td>
                <td className="num py-1">{fmt(o.installedNetMassKg, 0)}</td>
                <td className="num py-1">{fmt(o.achievedLifeYears, 1)}</td>
                <td className="num py-1">{o.cost ? fmt(o.cost.total, 0) : '–'}</td>
                <td className="num py-1">{o.warningsCount}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {unsuitable.length ? (
        <details className="text-xs text-ink-soft">
          <summary className="cursor-pointer">{unsuitable.length} model(s) not suitable for this job</summary>
          <ul className="mt-1 list-disc pl-5">
            {unsuitable.map((o) => (
              <li key={o.id}>
                {o.designation}: {o.reason}
              </li>
            ))}
          </ul>
        </details>
      ) : null}
      <p className="text-2xs text-ink-faint">Cost shows where the model has a unit price and the organisation a fitting rate per kg (gross mass).</p>
    </div>
  );
}
