import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_MARGIN_MONTHS,
  addMonthsUTC,
  forecastGroup,
  proposeRenewals,
  proposeRenewalsForFleet,
  type DockingInput,
  type RenewalGroupInput,
} from '@/lib/forecast';
import { DAY_MS, fieldOf, utc } from './helpers';

// An invented vessel: today 2025-01-15, dockings planned 2025-06-01, 2027-12-01 and
// 2030-06-01 (about 30 months apart — common practice for hull dockings).
const today = utc('2025-01-15');
const dockings: DockingInput[] = [
  { id: 'D1', date: utc('2025-06-01'), status: 'planned' },
  { id: 'D2', date: utc('2027-12-01') },
  { id: 'D3', date: utc('2030-06-01'), status: 'planned' },
];
const one = (group: RenewalGroupInput, over: { dockings?: DockingInput[]; marginMonths?: number } = {}) =>
  proposeRenewals({ groups: [group], dockings: over.dockings ?? dockings, today, ...(over.marginMonths !== undefined ? { marginMonths: over.marginMonths } : {}) })[0];

describe('proposeRenewals: the last docking before the deadline', () => {
  it('a group that outlives two dockings is proposed at the later one, D2', () => {
    // End of life 2030-03-01 (invented); deadline 2030-03-01 - 6 months = 2029-09-01.
    // D1 (2025-06-01) and D2 (2027-12-01) are before it, D3 (2030-06-01) after:
    // the last docking on or before the deadline is D2 — not D1, which would waste 2.5 years of anode.
    const p = one({ id: 'g-stern', endOfLife: utc('2030-03-01') });
    expect(p).toMatchObject({ groupId: 'g-stern', status: 'proposed', dockingId: 'D2', dockingDate: utc('2027-12-01'), deadline: utc('2029-09-01') });
    expect(p.reason).toMatch(/\b1 Dec 2027\b/); // names the chosen docking (D2) by its date
    expect(p.needsDockingBy).toBeUndefined();
  });

  it('a group whose deadline falls between D1 and D2 is proposed at D1', () => {
    // End of life 2028-03-01 -> deadline 2027-09-01, before D2 (2027-12-01): D1
    expect(one({ id: 'g', endOfLife: utc('2028-03-01') })).toMatchObject({ status: 'proposed', dockingId: 'D1', deadline: utc('2027-09-01') });
  });

  it('a group whose deadline comes before every docking but whose end of life does not is proposed inside the margin', () => {
    // End of life 2025-10-01 -> deadline 2025-04-01; the first docking D1 (2025-06-01) is after the deadline but
    // before the end of life: the group can still reach D1, inside the margin.
    const p = one({ id: 'g-bow', endOfLife: utc('2025-10-01') });
    expect(p).toMatchObject({ status: 'proposed', dockingId: 'D1', deadline: utc('2025-04-01'), withinMargin: true });
    expect(p.needsDockingBy).toBeUndefined();
    expect(p.earlierDocking).toBeUndefined();
    expect(p.reason).toMatch(/inside the 6 months margin/);
  });

  it('a group that cannot reach any docking is flagged with needsDockingBy = endOfLife - margin and an earlier docking by then', () => {
    // End of life 2025-05-01 is before D1 (2025-06-01) -> deadline 2024-11-01 is past (today 2025-01-15): overdue,
    // see below. With end of life 2025-08-01 and only D2/D3: deadline 2025-02-01, D2 (2027-12-01) after the end of life.
    const p = one({ id: 'g-bow', endOfLife: utc('2025-08-01') }, { dockings: dockings.slice(1) });
    expect(p).toMatchObject({ status: 'no-docking', needsDockingBy: utc('2025-02-01'), deadline: utc('2025-02-01'), overdue: false });
    expect(p.dockingId).toBeUndefined();
    expect(p.earlierDocking?.by).toEqual(utc('2025-02-01'));
    expect(p.earlierDocking?.reason).toMatch(/next docking \(1 Dec 2027\) is after the end of life 1 Aug 2025: plan an unplanned docking or campaign by 1 Feb 2025/);
  });

  it('a deadline already past is overdue, and the group is proposed at the very next docking', () => {
    // End of life 2025-05-01 -> deadline 2024-11-01, before today 2025-01-15. D1 (2025-06-01) is the next docking;
    // it is after the end of life, so an unplanned docking as soon as possible is asked for too.
    const p = one({ id: 'g', endOfLife: utc('2025-05-01') });
    expect(p).toMatchObject({ status: 'proposed', dockingId: 'D1', deadline: utc('2024-11-01'), overdue: true });
    expect(p.earlierDocking?.by).toEqual(today);
    // With no docking planned at all: no docking, overdue, a docking as soon as possible.
    const none = one({ id: 'g', endOfLife: utc('2025-05-01') }, { dockings: [] });
    expect(none).toMatchObject({ status: 'no-docking', needsDockingBy: utc('2024-11-01'), overdue: true });
    expect(none.earlierDocking?.by).toEqual(today);
  });

  it('the default margin is 6 months (practice)', () => {
    expect(DEFAULT_MARGIN_MONTHS).toBe(6);
    // End of life 2027-12-15: with 6 months the deadline is 2027-06-15 and D2 (2027-12-01) is
    // too late -> D1; with no margin D2 (two weeks before the end of life) would be chosen.
    expect(one({ id: 'g', endOfLife: utc('2027-12-15') })).toMatchObject({ dockingId: 'D1', deadline: utc('2027-06-15') });
    expect(one({ id: 'g', endOfLife: utc('2027-12-15') }, { marginMonths: 0 })).toMatchObject({ dockingId: 'D2', deadline: utc('2027-12-15') });
    expect(one({ id: 'g', endOfLife: utc('2027-12-15') }, { marginMonths: 6 })).toMatchObject({ dockingId: 'D1' });
  });

  it('the margin counts calendar months, clamped to the end of the month', () => {
    // 2028-08-31 - 6 months = 2028-02-29 (leap year); 2027-08-31 - 6 = 2027-02-28
    expect(one({ id: 'g', endOfLife: utc('2028-08-31') }).deadline).toEqual(utc('2028-02-29'));
    expect(one({ id: 'g', endOfLife: utc('2027-08-31') }).deadline).toEqual(utc('2027-02-28'));
  });

  it('cancelled dockings are ignored', () => {
    // Same group as "outlives two dockings": with D2 cancelled the last docking before 2029-09-01 is D1
    const withCancelled = dockings.map((d) => (d.id === 'D2' ? { ...d, status: 'cancelled' as const } : d));
    expect(one({ id: 'g', endOfLife: utc('2030-03-01') }, { dockings: withCancelled })).toMatchObject({ status: 'proposed', dockingId: 'D1' });
  });

  it('past dockings (and finished ones) are ignored', () => {
    // Deadline 2025-03-01 (end of life 2025-09-01). A docking on 2024-12-01 lies before the
    // deadline but is in the past; one marked done on 2025-02-01 cannot take a renewal. D1 (2025-06-01)
    // is the first docking the group can still reach (before its end of life), inside the margin.
    const p = one(
      { id: 'g', endOfLife: utc('2025-09-01') },
      { dockings: [{ id: 'old', date: utc('2024-12-01') }, { id: 'done', date: utc('2025-02-01'), status: 'done' }, ...dockings] },
    );
    expect(p).toMatchObject({ status: 'proposed', dockingId: 'D1', withinMargin: true });
    expect(p.overdue).toBeUndefined();
    // Without D1 the group reaches no docking: it needs one by its deadline.
    const q = one(
      { id: 'g', endOfLife: utc('2025-09-01') },
      { dockings: [{ id: 'old', date: utc('2024-12-01') }, { id: 'done', date: utc('2025-02-01'), status: 'done' }, ...dockings.slice(1)] },
    );
    expect(q).toMatchObject({ status: 'no-docking', needsDockingBy: utc('2025-03-01'), overdue: false });
  });

  it('a docking today counts, whatever the time of day', () => {
    // today 2025-01-15T15:00Z, docking 2025-01-15T00:00Z; deadline 2025-02-01 (end of life 2025-08-01)
    const p = proposeRenewals({
      groups: [{ id: 'g', endOfLife: utc('2025-08-01') }],
      dockings: [{ id: 'now', date: utc('2025-01-15') }],
      today: utc('2025-01-15T15:00:00Z'),
    })[0];
    expect(p).toMatchObject({ status: 'proposed', dockingId: 'now' });
  });

  it('flags atRisk when the early end of the band misses the proposed docking', () => {
    // End of life 2030-03-01 -> D2 (2027-12-01). Early 2028-01-01 -> 2027-07-01 < D2: at risk.
    const risky = one({ id: 'g', endOfLife: utc('2030-03-01'), early: utc('2028-01-01') });
    expect(risky).toMatchObject({ status: 'proposed', dockingId: 'D2', atRisk: true });
    expect(risky.reason).toMatch(/\b1 Jul 2027\b/);
    // Early 2029-01-01 -> 2028-07-01, after D2: not at risk
    expect(one({ id: 'g', endOfLife: utc('2030-03-01'), early: utc('2029-01-01') }).atRisk).toBeUndefined();
  });
});

describe('proposeRenewals: sound groups', () => {
  it('a group that never depletes gets nothing', () => {
    const p = one({ id: 'g', endOfLife: null });
    expect(p.status).toBe('sound');
    expect(p.dockingId).toBeUndefined();
    expect(p.deadline).toBeUndefined();
  });

  it('a group whose deadline is more than 30 months after the last planned docking is sound, with nextReviewBy', () => {
    // Dockings D1, D2 only; horizon = D2 + 30 months = 2030-06-01.
    // End of life 2031-01-01 -> deadline 2030-07-01, after the horizon: sound, review by 2030-07-01.
    const two = dockings.slice(0, 2);
    const p = one({ id: 'g', endOfLife: utc('2031-01-01') }, { dockings: two });
    expect(p).toMatchObject({ status: 'sound', nextReviewBy: utc('2030-07-01'), deadline: utc('2030-07-01') });
    expect(p.dockingId).toBeUndefined();
  });

  it('a group that will not last to the next expected docking is renewed at the last planned one', () => {
    // End of life 2030-11-01 -> deadline 2030-05-01, within D2 + 30 months (2030-06-01):
    // the next docking is expected after the deadline, so renew at D2 (hull anodes that
    // will not last to the next docking — practice, design-basis.md).
    expect(one({ id: 'g', endOfLife: utc('2030-11-01') }, { dockings: dockings.slice(0, 2) })).toMatchObject({ status: 'proposed', dockingId: 'D2' });
  });

  it('with no docking planned the horizon starts today', () => {
    // today + 30 months = 2027-07-15. Deadline 2027-06-01 (end of life 2027-12-01): needs a docking.
    expect(one({ id: 'g', endOfLife: utc('2027-12-01') }, { dockings: [] })).toMatchObject({ status: 'no-docking', needsDockingBy: utc('2027-06-01') });
    // Deadline 2027-09-01 (end of life 2028-03-01): after the horizon, nothing to book yet.
    expect(one({ id: 'g', endOfLife: utc('2028-03-01') }, { dockings: [] })).toMatchObject({ status: 'sound', nextReviewBy: utc('2027-09-01') });
  });
});

describe('proposeRenewals: confirmed renewals', () => {
  it('a confirmed renewal left untouched by a recompute', () => {
    // The group would now be proposed at D2 (end of life 2030-03-01), but its renewal was
    // confirmed at D1. A recompute, even after a new docking is added, keeps D1.
    const group: RenewalGroupInput = { id: 'g-rudder', endOfLife: utc('2030-03-01'), confirmedRenewal: { dockingId: 'D1' } };
    const first = one(group);
    const recomputed = one(group, { dockings: [...dockings, { id: 'D2b', date: utc('2029-01-01') }] });
    for (const p of [first, recomputed]) {
      expect(p).toMatchObject({ groupId: 'g-rudder', status: 'kept', dockingId: 'D1', dockingDate: utc('2025-06-01') });
      expect(p.warning).toBeUndefined();
    }
    // the same group without the confirmation would be moved to the later docking
    expect(one({ ...group, confirmedRenewal: null }).dockingId).toBe('D2');
  });

  it('a kept renewal at a cancelled, unknown or too-late docking stays kept but carries a warning', () => {
    const cancelled = dockings.map((d) => (d.id === 'D1' ? { ...d, status: 'cancelled' as const } : d));
    const c = one({ id: 'g', endOfLife: utc('2030-03-01'), confirmedRenewal: { dockingId: 'D1' } }, { dockings: cancelled });
    expect(c).toMatchObject({ status: 'kept', dockingId: 'D1' });
    expect(c.warning).toMatch(/cancelled/);
    expect(one({ id: 'g', endOfLife: utc('2030-03-01'), confirmedRenewal: { dockingId: 'X' } }).warning).toMatch(/not among/);
    // D3 (2030-06-01) is after the deadline 2029-09-01
    const late = one({ id: 'g', endOfLife: utc('2030-03-01'), confirmedRenewal: { dockingId: 'D3' } });
    expect(late.status).toBe('kept');
    expect(late.warning).toMatch(/after the deadline 1 Sep 2029\b/);
  });
});

describe('proposeRenewals with forecastGroup', () => {
  it('a survey that shortens the forecast moves the renewal to an earlier docking', () => {
    // The zinc group of forecast-group.test.ts, installed 2022-01-01: design end of life
    // 2,600 days later = 2029-02-13 -> deadline 2028-08-13 -> D2 (2027-12-01).
    // Survey two 8760-h years in (730 days: 2024-01-01) at 60 %: end of life four years in
    // = 1,460 days = 2025-12-31 -> deadline 2025-06-30 -> D1.
    const base = { installedOn: utc('2022-01-01'), quantity: 10, netMassPerAnodeKg: 10, utilisationFactor: 0.8, capacityAhPerKg: 780, currentA: 1 };
    const design = forecastGroup(base);
    const surveyed = forecastGroup({ ...base, surveys: [{ date: new Date(utc('2022-01-01').getTime() + 730 * DAY_MS), remainingFraction: 0.6 }] });
    const [a, b] = proposeRenewals({
      groups: [
        { id: 'design', endOfLife: design.endOfLife },
        { id: 'surveyed', endOfLife: surveyed.endOfLife },
      ],
      dockings,
      today,
    });
    expect(a).toMatchObject({ status: 'proposed', dockingId: 'D2', deadline: utc('2028-08-13') });
    expect(b).toMatchObject({ status: 'proposed', dockingId: 'D1', deadline: utc('2025-06-30') });
  });
});

describe('proposeRenewalsForFleet', () => {
  it('gives each asset the same proposals as proposeRenewals on its own', () => {
    const groupsA: RenewalGroupInput[] = [
      { id: 'a1', endOfLife: utc('2030-03-01') },
      { id: 'a2', endOfLife: utc('2025-10-01') },
    ];
    const groupsB: RenewalGroupInput[] = [{ id: 'b1', endOfLife: utc('2026-06-01') }];
    const dockingsB: DockingInput[] = [{ id: 'B1', date: utc('2025-09-01') }];
    const fleet = proposeRenewalsForFleet(
      [
        { assetId: 'A', groups: groupsA, dockings },
        { assetId: 'B', groups: groupsB, dockings: dockingsB },
      ],
      { today },
    );
    expect(fleet.map((f) => f.assetId)).toEqual(['A', 'B']);
    expect(fleet[0].proposals).toEqual(proposeRenewals({ groups: groupsA, dockings, today }));
    expect(fleet[1].proposals).toEqual(proposeRenewals({ groups: groupsB, dockings: dockingsB, today }));
    // b1: deadline 2025-12-01, B1 (2025-09-01) before it
    expect(fleet[1].proposals[0]).toMatchObject({ status: 'proposed', dockingId: 'B1' });
  });

  it('names the asset in the field of a bad value', () => {
    const field = fieldOf(() =>
      proposeRenewalsForFleet(
        [
          { assetId: 'A', groups: [], dockings },
          { assetId: 'B', groups: [], dockings: [{ id: 'x', date: new Date(Number.NaN) }] },
        ],
        { today },
      ),
    );
    expect(field).toBe('assets[1].dockings[0].date');
    expect(fieldOf(() => proposeRenewalsForFleet([], { today, marginMonths: -1 }))).toBe('opts.marginMonths');
  });
});

describe('proposeRenewals input checks', () => {
  it('rejects duplicate docking ids, unknown statuses, bad margins and bad group dates', () => {
    expect(fieldOf(() => proposeRenewals({ groups: [], dockings: [...dockings, { id: 'D1', date: utc('2031-01-01') }], today }))).toBe('dockings[3].id');
    expect(fieldOf(() => proposeRenewals({ groups: [], dockings: [{ id: 'x', date: today, status: 'maybe' as 'planned' }], today }))).toBe('dockings[0].status');
    expect(fieldOf(() => proposeRenewals({ groups: [], dockings, today, marginMonths: 1.5 }))).toBe('marginMonths');
    expect(fieldOf(() => proposeRenewals({ groups: [{ id: 'g', endOfLife: 'soon' as unknown as Date }], dockings, today }))).toBe('groups[0].endOfLife');
    expect(fieldOf(() => proposeRenewals({ groups: [{ id: '', endOfLife: null }], dockings, today }))).toBe('groups[0].id');
    expect(fieldOf(() => proposeRenewals({ groups: [], dockings, today: undefined as unknown as Date }))).toBe('today');
  });
});

describe('proposeRenewals: groups that are overdue or cannot reach the next docking (today 2 Dec 2026)', () => {
  const now = utc('2026-12-02');
  it('an overdue hull group due in October 2026 is proposed at its February 2027 docking, with an unplanned docking as soon as possible', () => {
    // Renew by 2026-10-15 (invented) -> deadline 2026-04-15, long past. The next docking is 2027-02-10: the group
    // goes on its list (before: no docking at all), and since that docking is after the renew-by date an
    // unplanned docking from today is suggested too.
    const [p] = proposeRenewals({ today: now, groups: [{ id: 'hull', renewBy: utc('2026-10-15') }], dockings: [{ id: 'feb', date: utc('2027-02-10') }, { id: 'later', date: utc('2029-08-01') }] });
    expect(p).toMatchObject({ status: 'proposed', dockingId: 'feb', dockingDate: utc('2027-02-10'), overdue: true, deadline: utc('2026-04-15') });
    expect(p.earlierDocking).toEqual({ by: now, reason: expect.stringMatching(/The next docking \(10 Feb 2027\) is after the renew by 15 Oct 2026: plan an unplanned docking or campaign as soon as possible \(from 2 Dec 2026\)/) });
    expect(p.reason).toMatch(/has passed, so the group is renewed at the next docking, 10 Feb 2027, which is after the renew by 15 Oct 2026\./);
  });

  it('an overdue jetty group is proposed at the next diving campaign, even one not after its renew-by date', () => {
    // Renew by 2027-03-01 -> deadline 2026-09-01, past; the campaign on 2027-01-20 comes before the renew-by date:
    // proposed there, inside the margin, no earlier campaign asked for.
    const [p] = proposeRenewals({ today: now, groups: [{ id: 'bents', renewBy: utc('2027-03-01') }], dockings: [{ id: 'dive', date: utc('2027-01-20') }] });
    expect(p).toMatchObject({ status: 'proposed', dockingId: 'dive', overdue: true, withinMargin: true });
    expect(p.earlierDocking).toBeUndefined();
  });

  it('a group that cannot reach the next docking gets an earlier docking with its date', () => {
    // Renew by 2027-09-01 -> deadline 2027-03-01; the only docking is 2027-11-01, after the renew-by date.
    const [p] = proposeRenewals({ today: now, groups: [{ id: 'g', renewBy: utc('2027-09-01') }], dockings: [{ id: 'nov', date: utc('2027-11-01') }] });
    expect(p).toMatchObject({ status: 'no-docking', overdue: false, needsDockingBy: utc('2027-03-01') });
    expect(p.earlierDocking?.by).toEqual(utc('2027-03-01'));
    expect(p.earlierDocking?.reason).toContain('by 1 Mar 2027 (the renew by 1 Sep 2027 less 6 months)');
  });

  it('the margin in words names the renew-by date, not the end of life', () => {
    const [p] = proposeRenewals({ today: now, groups: [{ id: 'g', renewBy: utc('2027-09-01') }], dockings: [{ id: 'a', date: utc('2027-02-01') }] });
    expect(p.reason).toBe('Renew at the docking of 1 Feb 2027, the last docking before the deadline 1 Mar 2027 (renew by 1 Sep 2027 less 6 months).');
  });
});

describe('proposeRenewals agrees with a plain linear scan (the binary search is exact)', () => {
  // Reference: the rules written the slow, obvious way.
  function reference(endOfLife: Date, docks: DockingInput[], margin: number, now: Date) {
    const deadline = addMonthsUTC(endOfLife, -margin);
    const day = (d: Date) => Math.floor(d.getTime() / DAY_MS);
    const usable = docks.filter((d) => (d.status ?? 'planned') === 'planned' && day(d.date) >= day(now));
    const earliest = [...usable].sort((a, b) => a.date.getTime() - b.date.getTime() || (a.id < b.id ? -1 : 1))[0];
    if (day(deadline) < day(now)) return earliest ? { status: 'proposed', dockingId: earliest.id, overdue: true } : { status: 'no-docking', overdue: true };
    const last = usable.reduce<Date>((m, d) => (d.date > m ? d.date : m), now);
    if (deadline.getTime() > addMonthsUTC(last, 30).getTime()) return { status: 'sound' };
    const before = usable.filter((d) => d.date.getTime() <= deadline.getTime());
    if (before.length === 0) {
      if (earliest && earliest.date.getTime() <= endOfLife.getTime()) return { status: 'proposed', dockingId: earliest.id, withinMargin: true };
      return { status: 'no-docking', overdue: false };
    }
    const best = before.reduce((m, d) => (d.date.getTime() > m.date.getTime() || (d.date.getTime() === m.date.getTime() && d.id > m.id) ? d : m));
    return { status: 'proposed', dockingId: best.id };
  }

  it('for random dockings and groups', () => {
    const base = Date.UTC(2025, 0, 1);
    const arb = fc.record({
      docks: fc.array(fc.record({ day: fc.integer({ min: -400, max: 4000 }), status: fc.constantFrom('planned', 'done', 'cancelled', undefined) }), { maxLength: 12 }),
      eols: fc.array(fc.integer({ min: -400, max: 6000 }), { minLength: 1, maxLength: 20 }),
      margin: fc.integer({ min: 0, max: 24 }),
      todayOffsetMs: fc.integer({ min: 0, max: DAY_MS - 1 }),
    });
    fc.assert(
      fc.property(arb, (a) => {
        const now = new Date(base + a.todayOffsetMs);
        const docks: DockingInput[] = a.docks.map((d, i) => ({ id: `d${String(i).padStart(2, '0')}`, date: new Date(base + d.day * DAY_MS), ...(d.status ? { status: d.status } : {}) }));
        const groups = a.eols.map((e, i) => ({ id: `g${i}`, endOfLife: new Date(base + e * DAY_MS) }));
        const got = proposeRenewals({ groups, dockings: docks, today: now, marginMonths: a.margin });
        got.forEach((p, i) => expect(p).toMatchObject(reference(groups[i].endOfLife, docks, a.margin, now)));
      }),
      { numRuns: 300 },
    );
  });
});

describe('proposeRenewals: the sentences follow the asset kind', () => {
  // A jetty's anodes are renewed in a diving campaign by a contractor; it never "docks" (common practice).
  const forKind = (assetKind: 'vessel' | 'structure', over: { dockings?: DockingInput[] } = {}) =>
    proposeRenewals({ groups: [{ id: 'g', endOfLife: utc('2025-08-01') }], dockings: over.dockings ?? [{ id: 'C1', date: utc('2027-12-01'), status: 'planned' }], today, assetKind })[0];

  it('a structure whose next campaign comes too late is told to plan a diving campaign, and no sentence says docking', () => {
    const p = forKind('structure');
    expect(p.earlierDocking?.reason).toMatch(/next campaign \(1 Dec 2027\) is after the end of life 1 Aug 2025: plan a diving campaign by 1 Feb 2025/);
    expect(`${p.reason} ${p.earlierDocking?.reason}`).not.toMatch(/dock/i);
  });

  it('a structure with nothing planned needs a campaign; a vessel with nothing planned needs an unplanned docking', () => {
    const jetty = forKind('structure', { dockings: [] });
    expect(jetty.reason).toMatch(/no campaign is planned, so the group needs a campaign by the deadline/);
    expect(`${jetty.reason} ${jetty.earlierDocking?.reason}`).not.toMatch(/dock/i);
    const ship = forKind('vessel', { dockings: [] });
    expect(ship.earlierDocking?.reason).toMatch(/No docking is planned: plan an unplanned docking by 1 Feb 2025/);
    expect(`${ship.reason} ${ship.earlierDocking?.reason}`).not.toMatch(/campaign/i);
  });

  it('a structure past its deadline is renewed at the next campaign', () => {
    const p = proposeRenewals({ groups: [{ id: 'g', endOfLife: utc('2025-03-01') }], dockings: [{ id: 'C1', date: utc('2025-02-10'), status: 'planned' }], today, assetKind: 'structure' })[0];
    expect(p).toMatchObject({ status: 'proposed', dockingId: 'C1', overdue: true });
    expect(p.reason).toMatch(/renewed at the next campaign, 10 Feb 2025/);
    expect(p.reason).not.toMatch(/dock/i);
  });
});
