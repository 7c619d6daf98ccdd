import { describe, expect, it } from 'vitest';
import { FORECAST_DATE_LABELS } from '@/lib/forecast';
import { RENEW_BY_DATE_WORDS, renewalRuleSentence } from '@/lib/words/renewal-rule';

describe('the renewal rule in words', () => {
  it('names the renew-by date with the label of lib/forecast/labels.ts', () => {
    expect(FORECAST_DATE_LABELS.renewBy).toBe('Renew by');
    expect(RENEW_BY_DATE_WORDS).toBe('the renew-by date');
  });

  it('states the margin and the threshold as the organisation set them', () => {
    expect(renewalRuleSentence({ marginMonths: 6, thresholdPercent: 25 })).toBe(
      'Renewals are proposed at the last docking at least 6 months before the renew-by date, when 25 % of the anode mass remains (or when the utilisation factor is used up, if that comes first). Owners set both on the Team page.',
    );
    expect(renewalRuleSentence({ marginMonths: 1, thresholdPercent: 40 })).toContain('at least 1 month before the renew-by date, when 40 % of the anode mass remains');
    expect(renewalRuleSentence({ marginMonths: 0, thresholdPercent: 5 })).toContain('at the last docking on or before the renew-by date, when 5 %');
  });
});
