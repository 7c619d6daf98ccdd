import { z } from 'zod';
import { pastDateOnlyField } from './date-only-field';

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
