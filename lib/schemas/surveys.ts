import { z } from 'zod';
import { pastDateOnlyField } from './date-only-field';
import { readingSchema } from './register';
import { multilineText, text } from './text';

import { SURVEY_ELECTRODE_VALUES } from '@/lib/surveys/electrodes';

export { SURVEY_ELECTRODE_VALUES };

const blankToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);
const optionalText = (max: number, { multiline = false } = {}) =>
  z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? null : v), (multiline ? multilineText() : text()).trim().max(max, `Use at most ${max} characters.`).nullable().default(null));

/** A survey's own fields as the edit form sends them (the asset it belongs to does not change). */
export const surveyEditSchema = z.object({
  surveyedOn: pastDateOnlyField('survey date'),
  method: z.enum(['diver', 'drop-cell', 'rov', 'dry-dock', 'other'], { error: 'Choose how the survey was made.' }),
  surveyor: optionalText(120),
  defaultElectrode: z.enum(SURVEY_ELECTRODE_VALUES, { error: 'Choose the reference electrode.' }),
  notes: optionalText(4000, { multiline: true }),
});

const REMAINING_PERCENT_RANGE = 'The remaining mass is between 0 and 100 %.';

/**
 * The remaining anode mass as the reading form asks for it, in per cent; the register keeps a fraction.
 * The message speaks in the field's own unit.
 */
export const remainingPercentField = z.preprocess(
  blankToUndefined,
  z.coerce
    .number({ error: 'Remaining: enter a number of per cent, e.g. 65.' })
    .refine(Number.isFinite, 'Remaining: enter a number of per cent, e.g. 65.')
    .pipe(z.number().min(0, REMAINING_PERCENT_RANGE).max(100, REMAINING_PERCENT_RANGE))
    .optional(),
);

/**
 * One reading as the "Add a reading" and "Edit" forms send it: the remaining mass in per cent, and the
 * electrode left blank meaning the survey's own electrode.
 */
export function readingFormSchema(surveyElectrode: (typeof SURVEY_ELECTRODE_VALUES)[number]) {
  return z
    .object({ remainingPercent: remainingPercentField })
    .passthrough()
    .transform(({ remainingPercent, ...rest }, context) => {
      const electrode = rest.electrode === '' || rest.electrode === undefined || rest.electrode === null ? surveyElectrode : rest.electrode;
      const parsed = readingSchema.safeParse({ ...rest, electrode, remainingFraction: remainingPercent === undefined ? null : remainingPercent / 100 });
      if (!parsed.success) {
        for (const issue of parsed.error.issues) context.addIssue({ code: 'custom', message: issue.message, path: issue.path[0] === 'remainingFraction' ? ['remainingPercent'] : issue.path });
        return z.NEVER;
      }
      return parsed.data;
    });
}

/** How a CSV import is asked for: the whole file, or (after the errors were shown) only its good lines. */
export const importModeSchema = z.object({
  goodLinesOnly: z.preprocess((v) => v === '1' || v === 'true' || v === true, z.boolean()).default(false),
});


/** The most items one capture request may carry; a phone sends a longer queue in several requests. */
export const CAPTURE_BATCH_MAX = 50;

/**
 * A batch from the phone's capture queue (POST /api/orgs/[org]/surveys/[surveyId]/capture), one member's. The envelope is
 * checked whole (every item must carry the UUID the phone gave it, so it can be answered); each item's own
 * fields are checked one by one (`captureReadingSchema`), so one bad item does not refuse the others.
 */
export const captureBatchSchema = z.object({
  /** The member who captured the items on the phone: they are recorded only under that member's own session. */
  capturedBy: text({ error: 'Say which member captured the items.' }).min(1, 'Say which member captured the items.').max(100),
  items: z
    .array(z.object({ deviceId: z.uuid({ error: 'Each item needs the UUID made on the device.' }) }).passthrough(), { error: 'Send the items as a list.' })
    .min(1, 'Send at least one item.')
    .max(CAPTURE_BATCH_MAX, `Send at most ${CAPTURE_BATCH_MAX} items at once.`),
});

const optionalNumber = z.preprocess((v) => (v === '' || v === undefined ? null : v), z.number({ error: 'Enter a number.' }).nullable());

/**
 * One captured reading: the fields of a reading typed in by hand, with the anode group named by its id (the
 * phone chose it from the list it was given) and the electrode left out meaning the survey's own.
 */
export function captureReadingSchema(surveyElectrode: (typeof SURVEY_ELECTRODE_VALUES)[number]) {
  return z
    .object({
      deviceId: z.uuid(),
      kind: z.literal('reading', { error: 'Only readings are sent this way.' }),
      anodeGroupId: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.uuid({ error: 'Choose one of the asset\'s anode groups.' }).nullable()),
      potentialV: optionalNumber,
      remainingFraction: optionalNumber,
    })
    .passthrough()
    .transform(({ deviceId, kind, anodeGroupId, ...rest }, context) => {
      const electrode = rest.electrode === '' || rest.electrode === undefined || rest.electrode === null ? surveyElectrode : rest.electrode;
      const parsed = readingSchema.safeParse({ ...rest, electrode: rest.potentialV === null ? null : electrode, anodeGroupLabel: null });
      if (!parsed.success) {
        // The phone asks for the remaining mass in per cent, so its message speaks in per cent too.
        for (const issue of parsed.error.issues) context.addIssue({ code: 'custom', message: issue.path[0] === 'remainingFraction' ? REMAINING_PERCENT_RANGE : issue.message, path: issue.path });
        return z.NEVER;
      }
      return { deviceId, kind, anodeGroupId, ...parsed.data };
    });
}
export type CaptureReading = z.output<ReturnType<typeof captureReadingSchema>>;

/** The answer for one item. */
export interface CaptureItemResult {
  deviceId: string;
  status: 'recorded' | 'duplicate' | 'conflict' | 'invalid';
  message: string;
  readingId?: string;
  fieldErrors?: Record<string, string[]>;
}
