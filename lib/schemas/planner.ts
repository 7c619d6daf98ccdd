import { z } from 'zod';
import { multilineText, text } from './text';
import { dateOnlyField, daysInOrder } from './date-only-field';

const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v);
const optionalDate = (label: string) => z.preprocess(blankToNull, dateOnlyField(label).nullable());
const optionalText = (max: number, { multiline = false } = {}) =>
  z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? null : v), (multiline ? multilineText() : text()).trim().max(max, `Use at most ${max} characters.`).nullable().default(null));

export const dockingSchema = z
  .object({
    assetId: z.uuid('Choose an asset.'),
    kind: z.enum(['intermediate', 'renewal-survey', 'unplanned', 'campaign'], { error: 'Choose the kind of docking or campaign.' }),
    plannedStart: dateOnlyField('planned start'),
    plannedEnd: optionalDate('planned end'),
    yard: optionalText(120),
    reference: optionalText(60),
    notes: optionalText(2000, { multiline: true }),
  })
  .refine((d) => daysInOrder(d.plannedStart, d.plannedEnd), { message: 'The planned end is before the start.', path: ['plannedEnd'] });

export const dockingUpdateSchema = z
  .object({
    kind: z.enum(['intermediate', 'renewal-survey', 'unplanned', 'campaign'], { error: 'Choose the kind.' }),
    status: z.enum(['planned', 'done', 'cancelled'], { error: 'Choose the status.' }),
    plannedStart: dateOnlyField('planned start'),
    plannedEnd: optionalDate('planned end'),
    actualStart: optionalDate('actual start'),
    actualEnd: optionalDate('actual end'),
    yard: optionalText(120),
    reference: optionalText(60),
    notes: optionalText(2000, { multiline: true }),
  })
  .refine((d) => daysInOrder(d.plannedStart, d.plannedEnd), { message: 'The planned end is before the start.', path: ['plannedEnd'] })
  .refine((d) => daysInOrder(d.actualStart, d.actualEnd), { message: 'The actual end is before the start.', path: ['actualEnd'] })
  .refine((d) => d.status !== 'done' || d.actualStart, { message: 'Enter the actual start of a docking that is done.', path: ['actualStart'] });

export const renewalUpdateSchema = z.object({
  quantity: z.coerce.number({ error: 'Enter the quantity.' }).int('Enter a whole number.').min(1, 'At least one anode.').max(10_000),
  dockingId: z.uuid('Choose a docking.'),
  notes: optionalText(2000, { multiline: true }),
});

export const fittedSchema = z.object({ fittedOn: dateOnlyField('fitting date') });

export const manualRenewalSchema = z.object({
  groupId: z.uuid('Choose an anode group.'),
  reason: z.enum(['survey-finding', 'damage', 'other', 'forecast-depletion'], { error: 'Choose the reason.' }),
  quantity: z.preprocess(blankToNull, z.coerce.number().int().min(1).max(10_000).nullable()),
  notes: optionalText(2000, { multiline: true }),
});
