import { z } from 'zod';
import { pastDateOnlyField } from './date-only-field';
import { readingSchema } from './register';
import { multilineText, text } from './text';

export const SURVEY_ELECTRODE_VALUES = ['ag-agcl-seawater', 'cse', 'sce', 'zinc'] as const;

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

/**
 * The remaining anode mass as the reading form asks for it, in per cent; the register keeps a fraction.
 * The message speaks in the field's own unit.
 */
export const remainingPercentField = z.preprocess(
  blankToUndefined,
  z.coerce
    .number({ error: 'Remaining: enter a number of per cent, e.g. 65.' })
    .refine(Number.isFinite, 'Remaining: enter a number of per cent, e.g. 65.')
    .pipe(z.number().min(0, 'The remaining mass is between 0 and 100 %.').max(100, 'The remaining mass is between 0 and 100 %.'))
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

