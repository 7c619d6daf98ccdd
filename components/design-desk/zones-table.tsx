'use client';
import { useEffect, useRef } from 'react';
import { zoneDensitySource } from '@/lib/design/build-design-input';
import { AREA_SOURCE_WORDS } from '@/lib/labels';
import { defaultVesselZones } from '@/lib/design/default-zones';
import { COATING_VALUES, DEPTH_BAND_VALUES, ZONE_KIND_VALUES, type DeskSurfaceDraft } from '@/lib/schemas/design';
import { COATING_LABELS, DEPTH_BAND_LABELS, ZONE_KIND_LABELS } from '@/lib/labels';
import { fmtInt, fmtSig } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { NumberInput, SelectInput, optionsFrom } from './desk-controls';
import type { DeskState, Update } from './desk-state';

interface Props {
  inputs: DeskState;
  update: Update;
  errors: Record<string, string[]>;
  editable: boolean;
  vessel: { lengthBppM: number | null; beamM: number | null; draughtM: number | null; blockCoefficient: number | null } | null;
}

/** The draft's zone as the calculation reads it; numbers still being typed count as 0 for the display. */
const asSurface = (zone: DeskSurfaceDraft) => ({ ...zone, areaM2: Number(zone.areaM2) || 0, coatingAgeYears: Number(zone.coatingAgeYears) || 0, temperatureC: zone.temperatureC === null || zone.temperatureC === '' ? null : Number(zone.temperatureC), currentDensityOverride: null });

export function ZonesTable({ inputs, update, errors, editable, vessel }: Props) {
  const disabled = !editable;
  const setZone = (index: number, change: Partial<DeskSurfaceDraft>) =>
    update((s) => ({ ...s, surfaces: s.surfaces.map((z, i) => (i === index ? { ...z, ...change } : z)) }));
  // After a removal, focus goes to the name of the zone that took its place (or the last one), not to the page body.
  const focusAfterRemoval = useRef<number | null>(null);
  useEffect(() => {
    if (focusAfterRemoval.current === null) return;
    const next = Math.min(focusAfterRemoval.current, inputs.surfaces.length - 1);
    focusAfterRemoval.current = null;
    document.getElementById(`zone-name-${next}`)?.focus();
  }, [inputs.surfaces.length]);
  const removeZone = (index: number) => {
    focusAfterRemoval.current = index;
    update((s) => ({ ...s, surfaces: s.surfaces.filter((_, i) => i !== index) }));
  };
  const addZone = () =>
    update((s) => ({
      ...s,
      surfaces: [...s.surfaces, { name: `Zone ${s.surfaces.length + 1}`, kind: 'other', areaM2: '', areaSource: 'entered', depthBand: '0-30', coatingCategory: 'II', coatingAgeYears: 0, currentDensityOverride: null, drainsCurrent: null, temperatureC: null }],
    }));
  const canEstimate = vessel && vessel.lengthBppM && vessel.beamM && vessel.draughtM && vessel.blockCoefficient;
  const estimate = () => {
    if (!vessel || !confirm('Replace the zones with estimates from the particulars (Denny-Mumford wetted surface)?')) return;
    update((s) => ({ ...s, surfaces: defaultVesselZones(vessel) }));
  };
  const totalArea = inputs.surfaces.reduce((sum, z) => sum + (Number(z.areaM2) || 0), 0);

  return (
    <div className="@container flex flex-col gap-3">
      {errors.surfaces ? <p role="alert" className="text-xs text-state-action">{errors.surfaces[0]}</p> : null}
      <ol className="flex flex-col gap-2">
        {inputs.surfaces.map((zone, i) => {
          const e = (field: string) => errors[`surfaces.${i}.${field}`];
          const method = zoneDensitySource(asSurface(zone), { ...inputs, serviceSpeedKnots: Number(inputs.serviceSpeedKnots) || null });
          const table = method.currentDensity;
          const custom = zone.currentDensityOverride;
          return (
            <li key={i} className="rounded-[3px] border border-rule bg-paper px-3 py-2" aria-label={`Zone ${i + 1}`}>
              <div className="grid grid-cols-2 gap-2 @xl:grid-cols-4 @4xl:grid-cols-6">
                <div className="col-span-2 flex flex-col gap-0.5">
                  <label className="text-xs text-ink-soft" htmlFor={`zone-name-${i}`}>
                    Zone name
                  </label>
                  <input
                    id={`zone-name-${i}`}
                    value={zone.name}
                    disabled={disabled}
                    onChange={(ev) => setZone(i, { name: ev.target.value })}
                    className={`rounded-[3px] border bg-paper-raised px-1.5 py-1 text-sm ${e('name') ? 'border-state-action' : 'border-rule-strong'}`}
                  />
                  {e('name') ? <p role="alert" className="text-2xs text-state-action">{e('name')![0]}</p> : null}
                </div>
                <SelectInput label="Kind" value={zone.kind} onChange={(v) => setZone(i, { kind: v as DeskSurfaceDraft['kind'] })} options={optionsFrom(ZONE_KIND_LABELS, ZONE_KIND_VALUES)} disabled={disabled} />
                <NumberInput
                  label="Area"
                  unit="m²"
                  value={zone.areaM2}
                  onChange={(v) => setZone(i, { areaM2: v, areaSource: 'entered' })}
                  errors={e('areaM2')}
                  disabled={disabled}
                  hint={AREA_SOURCE_WORDS[String(zone.areaSource)] ?? String(zone.areaSource)}
                />
                <NumberInput label="Water temperature here" unit="°C" value={zone.temperatureC ?? ''} onChange={(v) => setZone(i, { temperatureC: v })} errors={e('temperatureC')} disabled={disabled} hint="Optional; deep water is colder and more resistive" />
                <SelectInput label="Depth" value={zone.depthBand} onChange={(v) => setZone(i, { depthBand: v as DeskSurfaceDraft['depthBand'] })} options={optionsFrom(DEPTH_BAND_LABELS, DEPTH_BAND_VALUES)} disabled={disabled} />
                <SelectInput label="Coating" value={zone.coatingCategory} onChange={(v) => setZone(i, { coatingCategory: v as DeskSurfaceDraft['coatingCategory'] })} options={optionsFrom(COATING_LABELS, COATING_VALUES)} disabled={disabled} />
                {zone.coatingCategory !== 'bare' ? (
                  <NumberInput label="Coating age at start" unit="yr" value={zone.coatingAgeYears} onChange={(v) => setZone(i, { coatingAgeYears: v })} errors={e('coatingAgeYears')} disabled={disabled} />
                ) : (
                  <SelectInput
                    label="Bare item that drains current"
                    value={zone.drainsCurrent ?? ''}
                    onChange={(v) => setZone(i, { drainsCurrent: (v || null) as DeskSurfaceDraft['drainsCurrent'] })}
                    options={[{ value: '', label: 'No (steel)' }, { value: 'copper-alloy', label: 'Copper alloy' }, { value: 'stainless', label: 'Stainless steel' }]}
                    disabled={disabled}
                  />
                )}
                <div className="col-span-2 flex flex-col gap-0.5 @4xl:col-span-4">
                  <span className="text-xs text-ink-soft">Design current density (initial / mean / final){method.coatingApplies ? ', times the coating breakdown factor' : ''}</span>
                  {custom ? (
                    <div className="grid grid-cols-3 gap-2">
                      {(['initial', 'mean', 'final'] as const).map((k) => (
                        <NumberInput
                          key={k}
                          label={k}
                          unit="mA/m²"
                          value={custom[k]}
                          onChange={(v) => setZone(i, { currentDensityOverride: { ...custom, [k]: v } })}
                          errors={e(`currentDensityOverride.${k}`)}
                          disabled={disabled}
                        />
                      ))}
                    </div>
                  ) : (
                    <p className="num text-left text-sm whitespace-normal">
                      {fmtSig(table.initial * 1000)} / {fmtSig(table.mean * 1000)} / {fmtSig(table.final * 1000)} mA/m²{' '}
                      <span className="block text-2xs text-ink-faint">{method.source}</span>
                    </p>
                  )}
                </div>
                <div className="col-span-2 flex items-end justify-end gap-2">
                  {editable ? (
                    <>
                      <Button
                        type="button"
                        variant="ghost"
                        className="text-xs"
                        onClick={() =>
                          setZone(i, {
                            currentDensityOverride: custom ? null : { initial: table.initial * 1000, mean: table.mean * 1000, final: table.final * 1000 },
                          })
                        }
                      >
                        {custom ? 'Use the method\'s value' : 'Enter my own value'}
                      </Button>
                      <Button type="button" variant="danger" className="text-xs" onClick={() => removeZone(i)} disabled={inputs.surfaces.length <= 1} aria-label={`Remove zone ${zone.name}`}>
                        Remove
                      </Button>
                    </>
                  ) : null}
                </div>
              </div>
            </li>
          );
        })}
      </ol>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="num text-left text-xs text-ink-soft">
          Total area {fmtInt(totalArea)} m² in {inputs.surfaces.length} zone{inputs.surfaces.length === 1 ? '' : 's'}
        </p>
        {editable ? (
          <div className="flex gap-2">
            {canEstimate ? (
              <Button type="button" variant="secondary" onClick={estimate} className="text-xs">
                Estimate from particulars (Denny-Mumford)
              </Button>
            ) : null}
            <Button type="button" variant="secondary" onClick={addZone} className="text-xs">
              Add a zone
            </Button>
          </div>
        ) : null}
      </div>
    </div>
  );
}
