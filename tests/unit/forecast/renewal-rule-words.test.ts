import { describe, expect, it } from 'vitest';
import { FORECAST_DATE_LABELS } from '@/lib/forecast';
import { RENEW_BY_DATE_WORDS, renewalMarginSentence, renewalPlanWords, renewalRuleSentence } from '@/lib/labels';

describe('the renewal rule in words', () => {
  it('names the renew-by date with the label of lib/labels/forecast.ts', () => {
    expect(FORECAST_DATE_LABELS.renewBy).toBe('Renew by');
    expect(RENEW_BY_DATE_WORDS).toBe('the renew-by date');
  });

  it('states the margin and the threshold as the organisation set them', () => {
    expect(renewalRuleSentence({ marginMonths: 6, thresholdPercent: 25 }, 'vessel')).toBe(
      'Renewals are proposed at the last docking at least 6 months before the renew-by date, when 25 % of the anode mass remains (or when the utilisation factor is used up, if that comes first); a group already inside the margin is proposed at the next docking. Owners set both on the Team page.',
    );
    expect(renewalRuleSentence({ marginMonths: 1, thresholdPercent: 40 })).toContain('at least 1 month before the renew-by date, when 40 % of the anode mass remains');
    expect(renewalRuleSentence({ marginMonths: 0, thresholdPercent: 5 }, 'vessel')).toContain('at the last docking on or before the renew-by date, when 5 %');
    expect(renewalRuleSentence({ marginMonths: 0, thresholdPercent: 5 }, 'vessel')).toContain('; a group already past that date is proposed at the next docking.');
  });

  it('follows the asset: a structure is never docked, its anodes are renewed in a campaign', () => {
    const structure = renewalRuleSentence({ marginMonths: 6, thresholdPercent: 25 }, 'structure');
    expect(structure).toContain('at the last campaign at least 6 months');
    expect(structure).toContain('is proposed at the next campaign.');
    expect(structure).not.toMatch(/dock/);
    // A page listing both kinds names both.
    expect(renewalRuleSentence({ marginMonths: 6, thresholdPercent: 25 })).toContain('at the last docking or campaign at least 6 months');
  });
});

describe('where a renewal stands, in the words the planner and the asset page share', () => {
  it('names the docking, and says overdue, inside the margin or an earlier docking when so', () => {
    expect(renewalPlanWords({ status: 'proposed', dockingDate: '2027-02-10' })).toBe('Proposed at the docking of 10 Feb 2027');
    expect(renewalPlanWords({ status: 'proposed', dockingDate: '2027-02-10', overdue: true, earlierDockingBy: '2026-12-02' })).toBe(
      'Proposed at the docking of 10 Feb 2027 (overdue; plan an earlier docking by 2 Dec 2026)',
    );
    expect(renewalPlanWords({ status: 'proposed', dockingDate: '2027-01-20', withinMargin: true })).toBe('Proposed at the docking of 20 Jan 2027 (inside the margin)');
    expect(renewalPlanWords({ status: 'kept', dockingDate: '2027-01-20' })).toBe('Booked at the docking of 20 Jan 2027');
    expect(renewalPlanWords({ status: 'no-docking', deadline: '2027-03-01' })).toBe('Needs a docking by 1 Mar 2027');
    expect(renewalPlanWords({ status: 'no-docking', overdue: true, earlierDockingBy: '2026-12-02' })).toBe('Overdue: needs a docking as soon as possible (from 2 Dec 2026)');
    expect(renewalPlanWords({ status: 'sound', deadline: '2030-03-01' })).toBe('Nothing to book yet: book a docking by 1 Mar 2030');
    expect(renewalPlanWords({ status: 'sound' })).toBe('Needs no renewal');
  });

  it('says campaign for a structure', () => {
    expect(renewalPlanWords({ status: 'proposed', dockingDate: '2027-02-10', overdue: true, earlierDockingBy: '2026-12-02' }, 'structure')).toBe(
      'Proposed at the campaign of 10 Feb 2027 (overdue; plan an earlier campaign by 2 Dec 2026)',
    );
    expect(renewalPlanWords({ status: 'no-docking', deadline: '2027-03-01' }, 'structure')).toBe('Needs a campaign by 1 Mar 2027');
  });

  it('states the margin in words', () => {
    expect(renewalMarginSentence(6, 'vessel')).toBe(
      'The docking is booked at least 6 months before the renew-by date (the renewal margin), so the anodes are renewed before that date even if they wear faster than forecast.',
    );
    expect(renewalMarginSentence(1)).toContain('at least 1 month before');
    expect(renewalMarginSentence(0, 'vessel')).toBe('The docking is booked on or before the renew-by date (no renewal margin is set).');
    expect(renewalMarginSentence(0, 'structure')).toBe('The campaign is booked on or before the renew-by date (no renewal margin is set).');
    expect(renewalMarginSentence(0)).toBe('The docking or campaign is booked on or before the renew-by date (no renewal margin is set).');
  });
});
