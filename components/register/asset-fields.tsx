'use client';
import { Field, SelectField } from '@/components/ui/field';
import { STRUCTURE_TYPES } from '@/lib/schemas/assets';
import { HULL_MATERIAL_LABELS, STRUCTURE_TYPE_LABELS, WATER_TYPE_LABELS } from '@/lib/labels';
import { ANAEROBIC_STEEL_PROTECTION_POTENTIAL_V, AG_AGCL_SEAWATER_CALIBRATION_PSU, OVER_PROTECTION_LIMIT } from '@/lib/cp';
import { formatVolts } from '@/lib/surveys/criteria';

interface Props {
  /** Field-name prefix, for forms that post an asset together with other things. */
  prefix?: string;
  kind: string;
  values: Record<string, string | undefined>;
  errors?: Record<string, string[]>;
}

const HIGH_STRENGTH_LIMIT_V = OVER_PROTECTION_LIMIT['high-strength-steel']?.valueV;

/** What the survey criteria need, for either kind: the water's salinity, anaerobic conditions, high-strength steel. */
function SurveyCriteriaFields({ kind, n, v, e }: { kind: string; n: (name: string) => string; v: (name: string) => string | undefined; e: (name: string) => string[] | undefined }) {
  const checked = (name: string) => v(name) === 'on' || v(name) === 'true';
  return (
    <>
      <Field
        className="col-span-2"
        label="Water salinity (optional)"
        name={n('waterSalinityPsu')}
        type="number"
        step="any"
        unit="PSU"
        defaultValue={v('waterSalinityPsu')}
        errors={e('waterSalinityPsu')}
        hint={`${kind === 'vessel' ? 'Where surveys are taken. ' : ''}Blank: ${AG_AGCL_SEAWATER_CALIBRATION_PSU} PSU in seawater. Corrects readings against an Ag/AgCl/seawater electrode in brackish water.`}
      />
      <label className="col-span-2 flex items-start gap-2 text-sm">
        <input type="checkbox" className="mt-1" name={n('anaerobic')} defaultChecked={checked('anaerobic')} />
        <span>
          Anaerobic: sulphate-reducing bacteria or anaerobic mud <span className="text-xs text-ink-faint">(steel criterion {formatVolts(ANAEROBIC_STEEL_PROTECTION_POTENTIAL_V)} V)</span>
        </span>
      </label>
      <label className="col-span-2 flex items-start gap-2 text-sm">
        <input type="checkbox" className="mt-1" name={n('highStrengthSteel')} defaultChecked={checked('highStrengthSteel')} />
        <span>
          High-strength steel, yield above 550 MPa{' '}
          {HIGH_STRENGTH_LIMIT_V !== undefined ? <span className="text-xs text-ink-faint">(no more negative than about {formatVolts(HIGH_STRENGTH_LIMIT_V)} V)</span> : null}
        </span>
      </label>
      {e('highStrengthSteel') ? (
        <p role="alert" className="col-span-2 text-xs text-state-action">
          {e('highStrengthSteel')!.join(' ')}
        </p>
      ) : null}
    </>
  );
}

/** The particulars of a vessel or a structure; names match lib/schemas/assets.ts. */
export function AssetFields({ prefix = '', kind, values, errors = {} }: Props) {
  const n = (name: string) => `${prefix}${name}`;
  const v = (name: string) => values[n(name)];
  const e = (name: string) => errors[name];
  if (kind === 'vessel') {
    return (
      <div className="grid grid-cols-2 gap-3">
        <Field className="col-span-2" label="Name" name={n('name')} defaultValue={v('name')} errors={e('name')} />
        <Field label="Vessel type" name={n('vesselType')} defaultValue={v('vesselType')} errors={e('vesselType')} />
        <Field label="IMO number (optional)" name={n('imoNumber')} defaultValue={v('imoNumber')} errors={e('imoNumber')} inputMode="numeric" />
        <Field label="Length between perpendiculars" name={n('lengthBppM')} type="number" step="any" unit="m" defaultValue={v('lengthBppM')} errors={e('lengthBppM')} />
        <Field label="Beam" name={n('beamM')} type="number" step="any" unit="m" defaultValue={v('beamM')} errors={e('beamM')} />
        <Field label="Draught" name={n('draughtM')} type="number" step="any" unit="m" defaultValue={v('draughtM')} errors={e('draughtM')} />
        <Field label="Block coefficient" name={n('blockCoefficient')} type="number" step="any" defaultValue={v('blockCoefficient')} errors={e('blockCoefficient')} />
        <Field label="Frame spacing (optional)" name={n('frameSpacingM')} type="number" step="any" unit="m" defaultValue={v('frameSpacingM')} errors={e('frameSpacingM')} hint="For the drawing of the hull. Blank: estimated from the length." />
        <SelectField label="Hull material" name={n('hullMaterial')} defaultValue={v('hullMaterial') ?? 'steel'} options={Object.entries(HULL_MATERIAL_LABELS).map(([value, label]) => ({ value, label }))} errors={e('hullMaterial')} />
        <Field label="Usual trading waters" name={n('tradingWaters')} defaultValue={v('tradingWaters')} errors={e('tradingWaters')} />
        <label className="col-span-2 flex items-center gap-2 text-sm">
          <input type="checkbox" name={n('hasImpressedCurrent')} defaultChecked={v('hasImpressedCurrent') === 'on' || v('hasImpressedCurrent') === 'true'} /> Impressed-current system fitted
        </label>
        <SurveyCriteriaFields kind={kind} n={n} v={v} e={e} />
      </div>
    );
  }
  return (
    <div className="grid grid-cols-2 gap-3">
      <Field className="col-span-2" label="Name" name={n('name')} defaultValue={v('name')} errors={e('name')} />
      <SelectField
        label="Structure"
        name={n('structureType')}
        defaultValue={v('structureType') ?? 'jetty'}
        options={STRUCTURE_TYPES.map((t) => ({ value: t, label: STRUCTURE_TYPE_LABELS[t]! }))}
        errors={e('structureType')}
      />
      <SelectField label="Water" name={n('waterType')} defaultValue={v('waterType') ?? 'seawater'} options={(['seawater', 'brackish', 'fresh'] as const).map((value) => ({ value, label: WATER_TYPE_LABELS[value]! }))} errors={e('waterType')} />
      <Field label="Number of piles" name={n('pileCount')} type="number" defaultValue={v('pileCount')} errors={e('pileCount')} />
      <Field label="Pile rows (optional)" name={n('pileRows')} type="number" defaultValue={v('pileRows')} errors={e('pileRows')} hint="Lines of piles along the structure, lettered A, B, … on the plan." />
      <Field label="Pile bents (optional)" name={n('pileBents')} type="number" defaultValue={v('pileBents')} errors={e('pileBents')} hint="Lines across it, numbered 1, 2, …; blank: estimated from the piles and positions." />
      <Field label="Pile diameter" name={n('pileDiameterM')} type="number" step="any" unit="m" defaultValue={v('pileDiameterM')} errors={e('pileDiameterM')} />
      <Field label="Design life" name={n('designLifeYears')} type="number" step="any" unit="years" defaultValue={v('designLifeYears')} errors={e('designLifeYears')} />
      <Field label="Location" name={n('location')} defaultValue={v('location')} errors={e('location')} />
      <SurveyCriteriaFields kind={kind} n={n} v={v} e={e} />
    </div>
  );
}
