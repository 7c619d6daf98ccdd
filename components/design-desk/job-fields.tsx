'use client';
import { climateFromTemperature } from '@/lib/cp/lookups';
import { CLIMATE_VALUES, DEMAND_METHOD_VALUES, HULL_CONDITION_VALUES, POTENTIAL_SOURCE_VALUES, PROTECTED_METAL_VALUES, RESISTIVITY_SOURCE_VALUES, WATER_VALUES } from '@/lib/schemas/design';
import { CLIMATE_LABELS, DEMAND_METHOD_LABELS, HULL_CONDITION_LABELS, METAL_LABELS, POTENTIAL_SOURCE_LABELS, RESISTIVITY_SOURCE_LABELS, WATER_LABELS, versusElectrode } from '@/lib/labels';
import { CheckboxInput, NumberInput, SelectInput, optionsFrom } from './desk-controls';
import type { DeskState, Update } from './desk-state';

interface Props {
  inputs: DeskState;
  update: Update;
  errors: Record<string, string[]>;
  editable: boolean;
}

export function JobFields({ inputs, update, errors, editable }: Props) {
  const set = <K extends keyof DeskState>(key: K, value: DeskState[K]) => update((s) => ({ ...s, [key]: value }));
  const disabled = !editable;
  const temperature = Number(inputs.temperatureC);
  const bandFromTemperature = inputs.temperatureC !== null && inputs.temperatureC !== '' && Number.isFinite(temperature) ? climateFromTemperature(temperature) : null;
  return (
    <div className="@container"><div className="grid grid-cols-2 gap-3 @2xl:grid-cols-4">
      <SelectInput
        label="Current demand by"
        value={inputs.demandMethod}
        onChange={(v) => set('demandMethod', v as DeskState['demandMethod'])}
        options={optionsFrom(DEMAND_METHOD_LABELS, DEMAND_METHOD_VALUES)}
        errors={errors.demandMethod}
        disabled={disabled}
      />
      {inputs.demandMethod === 'ship-hull' ? (
        <>
          <SelectInput label="Hull coating condition" value={inputs.hullCoatingCondition} onChange={(v) => set('hullCoatingCondition', v as DeskState['hullCoatingCondition'])} options={optionsFrom(HULL_CONDITION_LABELS, HULL_CONDITION_VALUES)} errors={errors.hullCoatingCondition} disabled={disabled} />
          <NumberInput label="Service speed" unit="knots" value={inputs.serviceSpeedKnots} onChange={(v) => set('serviceSpeedKnots', v)} errors={errors.serviceSpeedKnots} disabled={disabled} hint="Optional; above 20 knots +25 %" />
        </>
      ) : null}
      <NumberInput label="Design life" unit="years" value={inputs.designLifeYears} onChange={(v) => set('designLifeYears', v)} errors={errors.designLifeYears} disabled={disabled} hint="Usually to the next dry-docking" />
      <NumberInput label="Next docking in" unit="years" value={inputs.nextDockingYears} onChange={(v) => set('nextDockingYears', v)} errors={errors.nextDockingYears} disabled={disabled} hint="Optional; warns if life is shorter" />
      <SelectInput label="Water" value={inputs.water} onChange={(v) => set('water', v as DeskState['water'])} options={optionsFrom(WATER_LABELS, WATER_VALUES)} errors={errors.water} disabled={disabled} />
      <SelectInput label="Temperature band (current density)" value={inputs.climate} onChange={(v) => set('climate', v as DeskState['climate'])} options={optionsFrom(CLIMATE_LABELS, CLIMATE_VALUES)} errors={errors.climate} disabled={disabled} />
      <NumberInput
        label="Water temperature"
        unit="°C"
        value={inputs.temperatureC}
        onChange={(v) => set('temperatureC', v)}
        errors={errors.temperatureC}
        disabled={disabled}
        hint={bandFromTemperature && bandFromTemperature !== inputs.climate ? `That is ${CLIMATE_LABELS[bandFromTemperature]}` : 'Optional; zinc limit 50 °C'}
      />
      <NumberInput label="Salinity" unit="PSU" value={inputs.salinityPsu} onChange={(v) => set('salinityPsu', v)} errors={errors.salinityPsu} disabled={disabled} hint={inputs.water === 'seawater' ? 'Optional; 35 PSU assumed' : 'Needed for the resistivity unless measured'} />
      <SelectInput label="Resistivity from" value={inputs.resistivitySource} onChange={(v) => set('resistivitySource', v as DeskState['resistivitySource'])} options={optionsFrom(RESISTIVITY_SOURCE_LABELS, RESISTIVITY_SOURCE_VALUES)} errors={errors.resistivitySource} disabled={disabled} />
      <NumberInput
        label="Resistivity"
        unit="Ω·m"
        value={inputs.resistivityOhmM}
        onChange={(v) => set('resistivityOhmM', v)}
        errors={errors.resistivityOhmM}
        disabled={disabled || inputs.resistivitySource === 'water'}
        hint={inputs.resistivitySource === 'water' ? 'Estimated from temperature and salinity; see the notes' : 'Measured at the site'}
      />
      <SelectInput label="Protective potential from" value={inputs.potentialSource} onChange={(v) => set('potentialSource', v as DeskState['potentialSource'])} options={optionsFrom(POTENTIAL_SOURCE_LABELS, POTENTIAL_SOURCE_VALUES)} errors={errors.potentialSource} disabled={disabled} />
      <NumberInput
        label="Protective potential"
        unit={versusElectrode('Ag/AgCl')}
        value={inputs.protectivePotentialV}
        onChange={(v) => set('protectivePotentialV', v)}
        errors={errors.protectivePotentialV}
        disabled={disabled || inputs.potentialSource === 'criterion'}
        hint={inputs.potentialSource === 'criterion' ? '-0.80 V steel, -0.90 V anaerobic or aluminium' : 'Less negative than the criterion warns'}
      />
      {inputs.water !== 'seawater' ? (
        <NumberInput label="Chloride" unit="ppm" value={inputs.chloridePpm} onChange={(v) => set('chloridePpm', v)} errors={errors.chloridePpm} disabled={disabled} hint="Al-Zn-In passivates below about 1,450 ppm" />
      ) : null}
      <SelectInput label="Protected metal" value={inputs.protectedMetal} onChange={(v) => set('protectedMetal', v as DeskState['protectedMetal'])} options={optionsFrom(METAL_LABELS, PROTECTED_METAL_VALUES)} errors={errors.protectedMetal} disabled={disabled} />
      <SelectInput
        label="Hull material"
        value={inputs.hullMaterial ?? ''}
        onChange={(v) => set('hullMaterial', (v || null) as DeskState['hullMaterial'])}
        options={[{ value: '', label: 'Not a hull' }, { value: 'steel', label: 'Steel hull' }, { value: 'aluminium', label: 'Aluminium hull' }]}
        disabled={disabled}
      />
      <div className="col-span-2 flex flex-col justify-end gap-1">
        <CheckboxInput label="Anaerobic, sulphate-reducing bacteria (steel criterion -0.90 V)" checked={Boolean(inputs.anaerobic)} onChange={(v) => set('anaerobic', v)} disabled={disabled} />
        {inputs.hullMaterial === 'aluminium' ? (
          <CheckboxInput label="Allow magnesium on this aluminium hull (not recommended)" checked={Boolean(inputs.allowMagnesiumOnAluminium)} onChange={(v) => set('allowMagnesiumOnAluminium', v)} disabled={disabled} />
        ) : null}
      </div>
    </div>
    </div>
  );
}
