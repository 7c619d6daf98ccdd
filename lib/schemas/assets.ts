import { z } from 'zod';
import { multilineText, text } from './text';

const optionalNumber = (label: string, unit: string, min: number, max: number) =>
  z.preprocess(
    (v) => (v === '' || v === null || v === undefined ? null : v),
    z.coerce
      .number({ error: `${label}: enter a number (${unit}).` })
      .refine(Number.isFinite, `${label}: enter a number (${unit}).`)
      .pipe(z.number().min(min, `${label} must be at least ${min} ${unit}.`).max(max, `${label} must be at most ${max} ${unit}.`))
      .nullable(),
  );
const optionalText = (max: number, { multiline = false } = {}) =>
  z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? null : v), (multiline ? multilineText() : text()).trim().max(max, `Use at most ${max} characters.`).nullable().default(null));
const checkbox = z.preprocess((v) => v === true || v === 'on' || v === 'true', z.boolean());

/**
 * What the survey criteria need, for either kind (lib/surveys/criteria.ts): the salinity of the water the
 * readings are taken in (the chloride correction of an Ag/AgCl/seawater electrode; blank = 35 PSU in
 * seawater), anaerobic conditions with sulphate-reducing bacteria, and high-strength steel (yield > 550 MPa).
 */
const surveyCriteriaFields = {
  waterSalinityPsu: optionalNumber('Water salinity', 'PSU', 0, 42),
  anaerobic: checkbox.default(false),
  highStrengthSteel: checkbox.default(false),
};

export const STRUCTURE_TYPES = ['jetty', 'wharf', 'dolphin', 'pontoon', 'sheet-pile-wall', 'other'] as const;

export const vesselSchema = z.object({
  kind: z.literal('vessel'),
  name: text().trim().min(1, 'Name the vessel.').max(120, 'Use at most 120 characters.'),
  imoNumber: z.preprocess(
    (v) => (typeof v === 'string' && v.trim() === '' ? null : v),
    text().trim().regex(/^\d{7}$/, 'An IMO number has 7 digits.').nullable().default(null),
  ),
  vesselType: optionalText(60),
  lengthBppM: optionalNumber('Length between perpendiculars', 'm', 3, 500),
  beamM: optionalNumber('Beam', 'm', 1, 80),
  draughtM: optionalNumber('Draught', 'm', 0.3, 30),
  blockCoefficient: optionalNumber('Block coefficient', '', 0.3, 0.95),
  // Left out (undefined): kept as it is; blank: not known (the drawing estimates it).
  frameSpacingM: optionalNumber('Frame spacing', 'm', 0.2, 3).optional(),
  hullMaterial: z.enum(['steel', 'aluminium'], { error: 'Choose the hull material.' }),
  hasImpressedCurrent: checkbox.default(false),
  tradingWaters: optionalText(120),
  ...surveyCriteriaFields,
  notes: optionalText(2000, { multiline: true }),
}).refine((v) => !(v.highStrengthSteel && v.hullMaterial === 'aluminium'), { message: 'High-strength steel applies to a steel hull, not an aluminium one.', path: ['highStrengthSteel'] });

export const structureSchema = z.object({
  kind: z.literal('structure'),
  name: text().trim().min(1, 'Name the structure.').max(120, 'Use at most 120 characters.'),
  structureType: z.enum(STRUCTURE_TYPES, { error: 'Choose the kind of structure.' }),
  location: optionalText(120),
  waterType: z.enum(['seawater', 'brackish', 'fresh'], { error: 'Choose the water type.' }),
  designLifeYears: optionalNumber('Design life', 'years', 1, 100),
  pileCount: optionalNumber('Number of piles', '', 1, 10000).pipe(z.number().int('Enter a whole number of piles.').nullable()),
  pileDiameterM: optionalNumber('Pile diameter', 'm', 0.05, 5),
  pileRows: optionalNumber('Pile rows', '', 1, 26).pipe(z.number().int('Enter a whole number of rows.').nullable()).optional(),
  pileBents: optionalNumber('Pile bents', '', 1, 200).pipe(z.number().int('Enter a whole number of bents.').nullable()).optional(),
  ...surveyCriteriaFields,
  notes: optionalText(2000, { multiline: true }),
});

export const assetSchema = z.discriminatedUnion('kind', [vesselSchema, structureSchema], { error: 'Choose vessel or structure.' });
export type AssetInput = z.infer<typeof assetSchema>;
