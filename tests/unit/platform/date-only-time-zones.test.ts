// Every path that shows a date-only value, run with the process in a zone behind UTC (New York)
// and one far ahead of it (Kiritimati, UTC+14). Node applies a change of process.env.TZ at once.
const HOST_TZ = process.env.TZ;
process.env.TZ = 'America/New_York';

import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Timeline } from '@/components/planner/timeline';
import { depletionChartHtml } from '@/components/register/depletion-chart';
import { depletionChartFigure } from '@/lib/figures/depletion-chart';
import { buildAnodeList } from '@/lib/anode-list';
import { renderAnodeListPdf } from '@/lib/anode-list/render-anode-list-pdf';
import { formatDateOnly, parseDateOnly, toDateOnly, todayDateOnly } from '@/lib/dates/date-only';
import { proposeNextDockings, proposeRenewals } from '@/lib/forecast';
import type { PlannerDocking } from '@/lib/server/services/planner/planner-view';
import { pdfText } from '@/tests/fixtures/pdf-text';
import { smallInput } from '../anode-list/helpers';

afterAll(() => {
  if (HOST_TZ === undefined) delete process.env.TZ;
  else process.env.TZ = HOST_TZ;
});

const DAY = '2027-03-14';
const day = (iso: string) => new Date(`${iso}T00:00:00Z`);

// Minutes that local time is behind UTC at 2027-03-14T00:00Z (New York is still on EST then).
describe.each([
  { zone: 'America/New_York', offset: 300 },
  { zone: 'Pacific/Kiritimati', offset: -840 },
])('with TZ=$zone', ({ zone, offset }) => {
  beforeAll(() => {
    process.env.TZ = zone;
  });

  it('the zone is in force (so the checks below are not run in UTC by accident)', () => {
    expect(day(DAY).getTimezoneOffset()).toBe(offset);
  });

  it('formatDateOnly, parseDateOnly, toDateOnly and todayDateOnly keep the calendar day', () => {
    expect(formatDateOnly(DAY)).toBe('14 Mar 2027');
    expect(formatDateOnly(parseDateOnly(DAY))).toBe('14 Mar 2027');
    expect(formatDateOnly('2027-03-01', 'MMM yyyy')).toBe('Mar 2027');
    expect(formatDateOnly('2027-03-31', 'MMM yyyy')).toBe('Mar 2027');
    expect(parseDateOnly(DAY).getTime()).toBe(Date.UTC(2027, 2, 14));
    expect(toDateOnly(parseDateOnly(DAY))).toBe(DAY);
    expect(todayDateOnly(new Date('2027-03-14T23:30:00Z'))).toBe(DAY);
    expect(todayDateOnly(new Date('2027-03-14T00:30:00Z'))).toBe(DAY);
  });

  it('the depletion chart labels surveys, end of life and dockings by their UTC day', () => {
    const series = [{ label: 'Bottom P1', points: [{ date: day('2025-01-01'), kg: 100 }, { date: day('2027-06-01'), kg: 8 }], surveys: [{ date: day(DAY), kg: 20 }], endKg: 10, endOfLife: day('2027-03-01') }];
    const figure = depletionChartFigure({ series, dockings: [{ date: day(DAY), label: `Docking ${formatDateOnly(DAY)}` }], today: day('2026-01-01') })!;
    const html = depletionChartHtml({ series, figure, src: '/chart.svg' }).value;
    // The chart's image and the page's marks over it (their tooltips) both name the UTC day.
    for (const markup of [figure.document, figure.marks]) {
      expect(markup).toContain('Bottom P1: surveyed 14 Mar 2027, 20 kg');
      expect(markup).toContain('end of life 1 Mar 2027 (utilisation factor used up)');
    }
    expect(html).toContain('(end of life Mar 2027)');
    expect(figure.document).toContain('Docking 14 Mar 2027');
  });

  it('the docking timeline names the docking and the renew-by day', () => {
    const docking: PlannerDocking = { id: 'd1', assetId: 'a1', assetName: 'Morwenna Tide', assetKind: 'vessel', kind: 'intermediate', status: 'planned', start: DAY, end: '2027-03-21', yard: null, renewals: 2, openRenewals: 2, massDueKg: 120 };
    const html = renderToStaticMarkup(
      createElement(Timeline, {
        org: 'pcl',
        assets: [{ id: 'a1', name: 'Morwenna Tide', kind: 'vessel' }],
        dockings: [docking],
        needsDocking: [{ assetId: 'a1', renewBy: DAY, group: 'Bottom P1', overdue: false }],
        today: day('2027-01-10'),
      }),
    );
    expect(html).toContain('Morwenna Tide: Intermediate docking 14 Mar 2027;');
    expect(html).toContain('Bottom P1: renew by 14 Mar 2027');
    expect(html).toMatch(/>Mar<\/text>/);
  });

  it("the forecast's renew-by and end-of-life days in its reasons", () => {
    const [renewal] = proposeRenewals({ today: day('2026-01-01'), groups: [{ id: 'g', endOfLife: day('2027-09-14') }], dockings: [] });
    expect(renewal).toMatchObject({ status: 'no-docking', needsDockingBy: day(DAY) });
    expect(renewal.reason).toContain('deadline 14 Mar 2027 (end of life 14 Sep 2027 less 6 months)');

    const [booked] = proposeRenewals({ today: day('2026-01-01'), groups: [{ id: 'g', endOfLife: day('2027-09-14') }], dockings: [{ id: 'D1', date: day(DAY) }] });
    expect(booked).toMatchObject({ status: 'proposed', dockingId: 'D1' });
    expect(booked.reason).toContain('Renew at the docking of 14 Mar 2027, the last docking before the deadline 14 Mar 2027');

    const dockings = proposeNextDockings({ lastDocking: day(DAY), lastRenewalSurvey: day(DAY), horizonYears: 6 });
    const survey = dockings.find((d) => d.kind === 'renewal-survey')!;
    expect(toDateOnly(survey.date)).toBe('2032-03-14');
    expect(survey.reason).toContain('after the renewal survey of 14 Mar 2027');
  });

  it('the anode list keeps the docking days and prints them as 14 Mar 2027', async () => {
    const list = buildAnodeList(smallInput({ docking: { kind: 'intermediate', plannedStart: DAY, plannedEnd: '2027-03-21', actualStart: DAY, yard: 'Saltmarsh Ship Repair', reference: null } }));
    expect(list.docking).toMatchObject({ plannedStart: DAY, plannedEnd: '2027-03-21', actualStart: DAY });
    const text = (await pdfText(await renderAnodeListPdf(list))).replace(/\s+/g, ' ');
    expect(text).toContain('14 Mar 2027 to 21 Mar 2027');
    expect(text).toContain('Actual start 14 Mar 2027');
    expect(text).toContain('docking from 14 Mar 2027');
    expect(text).not.toContain('13 Mar 2027');
    expect(text).not.toContain('15 Mar 2027');
  });
});
