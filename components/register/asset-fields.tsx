'use client';
import { Field, SelectField } from '@/components/ui/field';
import { STRUCTURE_TYPES } from '@/lib/schemas/assets';

interface Props {
  /** Field-name prefix, for forms that post an asset together with other things. */
  prefix?: string;
  kind: string;
  values: Record<string, string | undefined>;
  errors?: Record<string, string[]>;
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
        <SelectField label="Hull material" name={n('hullMaterial')} defaultValue={v('hullMaterial') ?? 'steel'} options={[{ value: 'steel', label: 'Steel' }, { value: 'aluminium', label: 'Aluminium' }]} errors={e('hullMaterial')} />
        <Field label="Usual trading waters" name={n('tradingWaters')} defaultValue={v('tradingWaters')} errors={e('tradingWaters')} />
        <label className="col-span-2 flex items-center gap-2 text-sm">
          <input type="checkbox" name={n('hasImpressedCurrent')} defaultChecked={v('hasImpressedCurrent') === 'on' || v('hasImpressedCurrent') === 'true'} /> Impressed-current system fitted
        </label>
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
        options={STRUCTURE_TYPES.map((t) => ({ value: t, label: t.replace(/-/g, ' ') }))}
        errors={e('structureType')}
      />
      <SelectField label="Water" name={n('waterType')} defaultValue={v('waterType') ?? 'seawater'} options={[{ value: 'seawater', label: 'Seawater' }, { value: 'brackish', label: 'Brackish' }, { value: 'fresh', label: 'Fresh' }]} errors={e('waterType')} />
      <Field label="Number of piles" name={n('pileCount')} type="number" defaultValue={v('pileCount')} errors={e('pileCount')} />
      <Field label="Pile diameter" name={n('pileDiameterM')} type="number" step="any" unit="m" defaultValue={v('pileDiameterM')} errors={e('pileDiameterM')} />
      <Field label="Design life" name={n('designLifeYears')} type="number" step="any" unit="years" defaultValue={v('designLifeYears')} errors={e('designLifeYears')} />
      <Field label="Location" name={n('location')} defaultValue={v('location')} errors={e('location')} />
    </div>
  );
}
