import { forecastDateWords } from './forecast';
import { formatDateOnly } from '@/lib/dates/date-only';
import { eventWords, MIXED_EVENT_WORDS } from './planner';

/**
 * The renewal rule in words: when a group is to be renewed (its renew-by date) and how far ahead of
 * that date the scheduler books the docking. One sentence, the same on the docking planner and the
 * asset page, built from the organisation's two settings. Safe for client code.
 */
export interface RenewalRuleSettings {
  /** Whole months between the docking and the renew-by date (the organisation's renewal margin). */
  marginMonths: number;
  /** Renew when less than this percentage of the original anode mass remains (the renewal threshold). */
  thresholdPercent: number;
}

const months = (n: number) => `${n} month${n === 1 ? '' : 's'}`;

/** "the renew-by date": the label of lib/labels/forecast.ts used as an adjective. */
export const RENEW_BY_DATE_WORDS = `the ${forecastDateWords('renewBy').replace(/ /g, '-')} date`;

/**
 * e.g. "Renewals are proposed at the last docking at least 6 months before the renew-by date, when 25 %
 * of the anode mass remains (or when the utilisation factor is used up, if that comes first). Owners set
 * both on the Team page."
 */
export function renewalRuleSentence({ marginMonths, thresholdPercent }: RenewalRuleSettings, assetKind?: string): string {
  const event = assetKind ? eventWords(assetKind).event : MIXED_EVENT_WORDS.event;
  const when = marginMonths > 0 ? `at least ${months(marginMonths)} before ${RENEW_BY_DATE_WORDS}` : `on or before ${RENEW_BY_DATE_WORDS}`;
  const late = marginMonths > 0 ? 'a group already inside the margin' : 'a group already past that date';
  return (
    `Renewals are proposed at the last ${event} ${when}, when ${thresholdPercent} % of the anode mass remains ` +
    `(or when the utilisation factor is used up, if that comes first); ${late} is proposed at the next ${event}. Owners set both on the Team page.`
  );
}

/** Where a group's renewal stands, as the planner and the asset page both show it (dates YYYY-MM-DD). */
export interface RenewalPlanSummary {
  status: 'proposed' | 'kept' | 'no-docking' | 'sound';
  dockingDate?: string | null;
  /** The renew-by date less the margin. */
  deadline?: string | null;
  overdue?: boolean;
  withinMargin?: boolean;
  /** An unplanned docking or campaign is needed by this date. */
  earlierDockingBy?: string | null;
}

/**
 * e.g. "Proposed at the docking of 10 Feb 2027 (overdue; plan an earlier docking from 2 Dec 2026)", "Needs a docking by
 * 1 Mar 2027", "Nothing to book yet: book a docking by 1 Mar 2030". One phrase, the same on every page.
 */
export function renewalPlanWords(p: RenewalPlanSummary, assetKind: string = 'vessel'): string {
  const { event } = eventWords(assetKind);
  const notes = [
    ...(p.overdue ? ['overdue'] : []),
    ...(p.withinMargin && !p.overdue ? ['inside the margin'] : []),
    ...(p.earlierDockingBy ? [`plan an earlier ${event} by ${formatDateOnly(p.earlierDockingBy)}`] : []),
  ];
  const tail = notes.length ? ` (${notes.join('; ')})` : '';
  switch (p.status) {
    case 'kept':
      return `Booked at the ${event} of ${p.dockingDate ? formatDateOnly(p.dockingDate) : '(unknown)'}`;
    case 'proposed':
      return `Proposed at the ${event} of ${p.dockingDate ? formatDateOnly(p.dockingDate) : '(unknown)'}${tail}`;
    case 'no-docking':
      return p.overdue
        ? `Overdue: needs a ${event} as soon as possible${p.earlierDockingBy ? ` (from ${formatDateOnly(p.earlierDockingBy)})` : ''}`
        : `Needs a ${event} by ${p.deadline ? formatDateOnly(p.deadline) : '(unknown)'}`;
    default:
      return p.deadline ? `Nothing to book yet: book a ${event} by ${formatDateOnly(p.deadline)}` : 'Needs no renewal';
  }
}

/** The margin in words, e.g. "The docking is booked at least 6 months before the renew-by date." */
export function renewalMarginSentence(marginMonths: number, assetKind?: string): string {
  const event = assetKind ? eventWords(assetKind).event : MIXED_EVENT_WORDS.event;
  return marginMonths > 0
    ? `The ${event} is booked at least ${months(marginMonths)} before ${RENEW_BY_DATE_WORDS} (the renewal margin), so the anodes are renewed before that date even if they wear faster than forecast.`
    : `The ${event} is booked on or before ${RENEW_BY_DATE_WORDS} (no renewal margin is set).`;
}
