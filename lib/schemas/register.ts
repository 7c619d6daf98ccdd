import { z } from 'zod';
import { multilineText, text } from './text';
import { ZONE_KIND_VALUES, CLIMATE_VALUES, DEPTH_BAND_VALUES, COATING_VALUES, ANODE_ALLOY_VALUES, ANODE_MOUNTING_VALUES } from './design';
import { dateOnlyField, pastDateOnlyField } from './date-only-field';

const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v);
const optionalText = (max: number, { multiline = false } = {}) =>
  z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? null : v), (multiline ? multilineText() : text()).trim().max(max, `Use at most ${max} characters.`).nullable().default(null));
const number = (label: string, unit: string) =>
  z.preprocess((v) => (v === '' || v === null ? undefined : v), z.coerce.number({ error: `${label}: enter a number${unit ? ` (${unit})` : ''}.` }).refine(Number.isFinite, `${label}: enter a number.`));

export const zoneSchema = z.object({
  name: text().trim().min(1, 'Name the zone.').max(80, 'Use at most 80 characters.'),
  kind: z.enum(ZONE_KIND_VALUES, { error: 'Choose a zone kind.' }),
  areaM2: number('Area', 'm²').pipe(z.number().gt(0, 'The area must be more than 0 m².').max(1_000_000, 'An area above 1,000,000 m² is not plausible.')),
  coatingCategory: z.enum(COATING_VALUES, { error: 'Choose a coating category or bare.' }),
  coatingAgeYears: number('Coating age', 'years').pipe(z.number().min(0, 'The coating age cannot be negative.').max(60)).default(0),
  waterType: z.enum(['seawater', 'brackish', 'fresh', 'sediment'], { error: 'Choose the water type.' }),
  climate: z.enum(CLIMATE_VALUES, { error: 'Choose the temperature band.' }),
  depthBand: z.enum(DEPTH_BAND_VALUES, { error: 'Choose the depth band.' }),
  drainsCurrent: z.preprocess(blankToNull, z.enum(['copper-alloy', 'stainless']).nullable()),
});

export const anodeGroupSchema = z.object({
  zoneId: z.preprocess(blankToNull, z.uuid('Choose a zone.').nullable()),
  label: text().trim().min(1, 'Give the group a label (e.g. "Bottom P1" or "Row B").').max(60, 'Use at most 60 characters.'),
  anodeModelKey: text().min(1, 'Choose an anode model.').max(80),
  quantity: number('Quantity', '').pipe(z.number().int('Enter a whole number of anodes.').min(1, 'At least one anode.').max(10_000, 'At most 10,000 anodes in one group.')),
  positions: optionalText(2000, { multiline: true }),
  installedOn: pastDateOnlyField('installation date'),
  designId: z.preprocess(blankToNull, z.uuid().nullable()),
  meanCurrentA: z.preprocess(blankToNull, number('Mean current', 'A').pipe(z.number().min(0, 'The current cannot be negative.').max(10_000)).nullable()),
  notes: optionalText(2000, { multiline: true }),
});

export const removeGroupSchema = z.object({
  removedOn: pastDateOnlyField('removal date'),
  reason: multilineText().trim().min(1, 'Say why the group was removed.').max(200),
});

export const anodeModelSchema = z.object({
  designation: text().trim().min(1, 'Give the model a designation.').max(60),
  alloy: z.enum(ANODE_ALLOY_VALUES, { error: 'Choose the alloy.' }),
  mounting: z.enum(ANODE_MOUNTING_VALUES, { error: 'Choose the mounting.' }),
  shapeKind: z.enum(['slender-standoff', 'long-flush', 'short-flush', 'bracelet'], { error: 'Choose the resistance formula.' }),
  lengthM: number('Length', 'm').pipe(z.number().gt(0, 'The length must be more than 0 m.').max(10)),
  widthM: z.preprocess(blankToNull, number('Width', 'm').pipe(z.number().gt(0).max(5)).nullable()),
  thicknessM: z.preprocess(blankToNull, number('Thickness', 'm').pipe(z.number().gt(0).max(2)).nullable()),
  radiusM: z.preprocess(blankToNull, number('Equivalent radius', 'm').pipe(z.number().gt(0).max(2)).nullable()),
  standoffM: z.preprocess(blankToNull, number('Stand-off', 'm').pipe(z.number().min(0).max(5)).nullable()),
  exposedAreaM2: z.preprocess(blankToNull, number('Exposed area', 'm²').pipe(z.number().gt(0).max(50)).nullable()),
  netMassKg: number('Net mass', 'kg').pipe(z.number().gt(0, 'The net mass must be more than 0 kg.').max(5000)),
  grossMassKg: number('Gross mass', 'kg').pipe(z.number().gt(0, 'The gross mass must be more than 0 kg.').max(6000)),
  ratedOutputA: z.preprocess(blankToNull, number('Rated output', 'A').pipe(z.number().gt(0).max(100)).nullable()),
  ratedAtResistivityOhmM: z.preprocess(blankToNull, number('Resistivity of the rated output', 'Ω·m').pipe(z.number().gt(0).max(10000)).nullable()).default(null),
  unitPrice: z.preprocess(blankToNull, number('Unit price', '').pipe(z.number().min(0).max(1_000_000)).nullable()),
  notes: optionalText(2000, { multiline: true }),
});

export const surveySchema = z.object({
  assetId: z.uuid('Choose an asset.'),
  surveyedOn: pastDateOnlyField('survey date'),
  method: z.enum(['diver', 'drop-cell', 'rov', 'dry-dock', 'other'], { error: 'Choose how the survey was made.' }),
  surveyor: optionalText(120),
  defaultElectrode: z.enum(['ag-agcl-seawater', 'cse', 'sce', 'zinc'], { error: 'Choose the reference electrode.' }),
  notes: optionalText(4000, { multiline: true }),
});

/** The caption sent with a survey photo or report (multipart field "caption"). */
export const attachmentCaptionSchema = z.object({ caption: optionalText(200, { multiline: true }) });

/** The largest photo or report a survey takes. */
export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024;
/** What a survey takes: JPEG and PNG photos and PDF reports (the stored type is sniffed from the bytes). */
export const ATTACHMENT_CONTENT_TYPES = ['image/jpeg', 'image/png', 'application/pdf'] as const;

/**
 * A browser's request for an upload link (POST .../attachments/uploads). `deviceId` names the item on the
 * device that sends it; the same id later is the same upload (the same object key, a fresh link).
 */
export const attachmentUploadRequestSchema = z.object({
  deviceId: text({ error: 'The upload needs the id of the item on your device.' }).regex(/^[A-Za-z0-9_-]{8,64}$/, 'The device item id must be 8 to 64 letters, digits, "-" or "_".'),
  filename: text().trim().min(1, 'The file needs a name.').max(200, 'The file name must be at most 200 characters.'),
  contentType: z.enum(ATTACHMENT_CONTENT_TYPES, { error: 'Only JPEG and PNG photos and PDF reports can be attached.' }),
  sizeBytes: z
    .number({ error: 'The size of the file in bytes is needed.' })
    .int('The size of the file in bytes is needed.')
    .min(1, 'The file is empty.')
    .max(MAX_ATTACHMENT_BYTES, `The file is larger than ${MAX_ATTACHMENT_BYTES / 1024 / 1024} MB; reduce it and try again.`),
  caption: optionalText(200, { multiline: true }),
  /** The member who took the photo on the device (the offline queue says so); one taken by another member is refused. */
  capturedBy: text().min(1).max(100).optional(),
});
export type AttachmentUploadRequest = z.infer<typeof attachmentUploadRequestSchema>;

export const listQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(5).max(200).default(50),
  sort: text().max(40).optional(),
  dir: z.enum(['asc', 'desc']).default('asc'),
  q: text().trim().max(100).optional(),
  archived: z.enum(['0', '1']).default('0'),
  assetId: z.uuid().optional(),
});
export type ListQuery = z.infer<typeof listQuerySchema>;

/** One survey reading: where, the potential and its electrode, or what remains of an anode group. */
export const readingSchema = z
  .object({
    location: text().trim().min(1, 'Enter where the reading was taken.').max(80),
    potentialV: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.coerce.number().min(-2, 'A potential below -2.0 V is not plausible.').max(0.5, 'A potential above +0.5 V is not plausible.').nullable()),
    electrode: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.enum(['ag-agcl-seawater', 'cse', 'sce', 'zinc']).nullable()),
    anodeGroupLabel: z.preprocess((v) => (v === '' || v === undefined ? null : v), text().trim().max(60).nullable()),
    remainingFraction: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.coerce.number().min(0, 'The remaining fraction is between 0 and 1.').max(1, 'The remaining fraction is between 0 and 1.').nullable()),
    comment: z.preprocess((v) => (v === '' || v === undefined ? null : v), multilineText().max(500).nullable()),
  })
  .refine((r) => r.potentialV !== null || r.remainingFraction !== null, { message: 'Enter a potential or a remaining fraction.', path: ['potentialV'] })
  .refine((r) => r.potentialV === null || r.electrode !== null, { message: 'Say which reference electrode was used.', path: ['electrode'] });
