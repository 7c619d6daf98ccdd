'use client';
import { ALLOYS } from '@/lib/cp/tables/alloys';
import { utilisationFactorFor } from '@/lib/cp/lookups';
import type { CatalogueModel } from '@/lib/server/services/catalogue/anode-models';
import type { AnodeModelSnapshot } from '@/lib/schemas/design-record';
import { ALLOY_LABELS, MODEL_SOURCE_LABELS, MOUNTING_LABELS, versusElectrode } from '@/lib/labels';
import { fmt } from '@/lib/format';
import type { DeskState, Update } from './desk-state';

interface Props {
  inputs: DeskState;
  update: Update;
  errors: Record<string, string[]>;
  editable: boolean;
  catalogue: CatalogueModel[];
  /** A signed revision's stored model: while its key is chosen, its snapshot is shown, not today's catalogue entry. */
  stored?: { key: string; model: AnodeModelSnapshot | null };
}

export function AnodePicker({ inputs, update, errors, editable, catalogue, stored: signed }: Props) {
  const listed = catalogue.find((m) => m.key === inputs.anodeModelKey);
  const stored = signed && signed.key === inputs.anodeModelKey ? signed : null;
  const model: AnodeModelSnapshot | undefined = stored ? (stored.model ?? undefined) : listed;
  const groups = Object.entries(
    catalogue.reduce<Record<string, CatalogueModel[]>>((acc, m) => {
      (acc[`${ALLOY_LABELS[m.alloy]} · ${MODEL_SOURCE_LABELS[m.source] ?? 'Catalogue'}`] ??= []).push(m);
      return acc;
    }, {}),
  );
  const alloy = model ? ALLOYS[model.alloy] : null;
  return (
    <div className="flex flex-col gap-3">
      <label className="flex flex-col gap-0.5 text-xs text-ink-soft">
        Anode model (catalogue)
        <select
          value={inputs.anodeModelKey}
          disabled={!editable}
          onChange={(e) => update((s) => ({ ...s, anodeModelKey: e.target.value }))}
          className={`rounded-[3px] border bg-paper-raised px-1.5 py-1 text-sm text-ink ${errors.anodeModelKey ? 'border-state-action' : 'border-rule-strong'}`}
        >
          {stored && !listed ? <option value={inputs.anodeModelKey}>{stored.model ? `${stored.model.designation} (as stored with this revision)` : inputs.anodeModelKey}</option> : null}
          {!stored && !listed ? <option value={inputs.anodeModelKey}>Not in the catalogue: choose one</option> : null}
          {groups.map(([group, models]) => (
            <optgroup key={group} label={group}>
              {models.map((m) => (
                <option key={m.key} value={m.key}>
                  {m.designation}: {MOUNTING_LABELS[m.mounting]}, {fmt(m.netMassKg, 1)} kg net
                </option>
              ))}
            </optgroup>
          ))}
        </select>
      </label>
      {errors.anodeModelKey ? <p role="alert" className="text-xs text-state-action">{errors.anodeModelKey[0]}</p> : null}
      {stored && !stored.model ? <p className="text-xs text-ink-soft">The model&apos;s details were not recorded with this revision.</p> : null}
      {model && alloy ? (
        <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm md:grid-cols-4">
          <Fact label="Alloy" value={ALLOY_LABELS[model.alloy]} />
          <Fact label="Mounting" value={MOUNTING_LABELS[model.mounting]} />
          <Fact label="Net / gross mass" value={`${fmt(model.netMassKg, 1)} / ${fmt(model.grossMassKg, 1)} kg`} />
          <Fact label="Utilisation factor" value={fmt(model.utilisationFactor ?? utilisationFactorFor(model.shape), 2)} />
          <Fact label="Electrochemical capacity" value={`${fmt(model.capacityAhPerKg ?? alloy.capacityAhPerKg.seawater, 0)} A·h/kg`} />
          <Fact label="Closed-circuit potential" value={`${fmt(model.potentialV ?? alloy.closedCircuitPotentialV.seawater, 3)} ${versusElectrode('Ag/AgCl')}`} />
          <Fact label="Resistance formula" value={model.shape.kind.replace('-', ' ')} />
          <Fact label="Rated output" value={model.ratedOutputA ? `${fmt(model.ratedOutputA, 2)} A (data sheet)` : 'computed'} />
        </dl>
      ) : null}
    </div>
  );
}

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-2xs uppercase tracking-wide text-ink-faint">{label}</dt>
      <dd className="num text-left">{value}</dd>
    </div>
  );
}
