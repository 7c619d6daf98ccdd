import { z } from 'zod';
import { pastDateOnlyField } from './date-only-field';
import { multilineText, text } from './text';

const checkbox = z.preprocess((v) => v === true || v === 'on' || v === 'true', z.boolean());

/**
 * "Fit this design": the approved revision's anodes either fitted on a day (installed groups) or
 * booked as renewals at a planned docking. `confirmSecondFit` is the user's "yes, fit it again"
 * when the revision was already fitted on the asset (a double click must not fit it twice).
 */
export const fitDesignSchema = z.discriminatedUnion(
  'mode',
  [
    z.object({ mode: z.literal('installed'), fittedOn: pastDateOnlyField('fitting date'), confirmSecondFit: checkbox.default(false) }),
    z.object({ mode: z.literal('renewal'), dockingId: z.uuid('Choose a planned docking or campaign.'), confirmSecondFit: checkbox.default(false) }),
  ],
  { error: 'Choose whether the anodes are fitted now or booked at a docking.' },
);
export type FitDesignInput = z.infer<typeof fitDesignSchema>;

/**
 * The positions the engineer kept or edited on the fit form, zone by zone: fields `position-<i>` (the text) with
 * `positionZone-<i>` (the zone's name). A zone left out gets the proposal; a blank text stores no position.
 */
export const fitPositionsSchema = z
  .array(
    z.object({
      zone: text().trim().min(1).max(80),
      text: z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? null : v), multilineText().trim().max(2000, 'Use at most 2000 characters.').nullable()),
    }),
  )
  .max(100);

/** The zone positions of a fit form's fields (see fitPositionsSchema), in field order. */
export function fitPositionsFrom(input: unknown): z.infer<typeof fitPositionsSchema> {
  const fields = (input && typeof input === 'object' ? input : {}) as Record<string, unknown>;
  const indexes = Object.keys(fields)
    .map((k) => /^position-(\d{1,3})$/.exec(k)?.[1])
    .filter((i): i is string => i !== undefined)
    .sort((a, b) => Number(a) - Number(b));
  return fitPositionsSchema.parse(indexes.map((i) => ({ zone: fields[`positionZone-${i}`], text: fields[`position-${i}`] })));
}
