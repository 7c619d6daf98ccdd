import { forecastDateWords } from '@/lib/forecast/labels';

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

/** "the renew-by date": the label of lib/forecast/labels.ts used as an adjective. */
export const RENEW_BY_DATE_WORDS = `the ${forecastDateWords('renewBy').replace(/ /g, '-')} date`;

/**
 * e.g. "Renewals are proposed at the last docking at least 6 months before the renew-by date, when 25 %
 * of the anode mass remains (or when the utilisation factor is used up, if that comes first). Owners set
 * both on the Team page."
 */
export function renewalRuleSentence({ marginMonths, thresholdPercent }: RenewalRuleSettings): string {
  const when = marginMonths > 0 ? `at least ${months(marginMonths)} before ${RENEW_BY_DATE_WORDS}` : `on or before ${RENEW_BY_DATE_WORDS}`;
  return (
    `Renewals are proposed at the last docking ${when}, when ${thresholdPercent} % of the anode mass remains ` +
    '(or when the utilisation factor is used up, if that comes first). Owners set both on the Team page.'
  );
}
