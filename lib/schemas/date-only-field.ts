import { z } from 'zod';
import { text } from './text';
import { compareDateOnly, isDateOnly, todayDateOnly } from '@/lib/dates/date-only';

/** A form field holding a calendar day, 'YYYY-MM-DD' (what an <input type="date"> sends), checked strictly. */
export const dateOnlyField = (label: string) =>
  text({ error: `Enter the ${label}.` })
    .regex(/^\d{4}-\d{2}-\d{2}$/, `Enter the ${label} as a date (YYYY-MM-DD).`)
    .refine(isDateOnly, `The ${label} is not a real date.`);

/** A calendar day that is today (UTC) or earlier: installations and surveys that have happened. */
export const pastDateOnlyField = (label: string) =>
  dateOnlyField(label).refine((d) => !isDateOnly(d) || compareDateOnly(d, todayDateOnly()) <= 0, `The ${label} cannot be in the future.`);

/**
 * Whether `end` is on or after `start`. True when either is missing or not a real day: zod runs
 * refinements on values whose own field already failed, and that field's message is the one to show.
 */
export const daysInOrder = (start: string | null | undefined, end: string | null | undefined) =>
  !isDateOnly(start) || !isDateOnly(end) || compareDateOnly(end, start) >= 0;
