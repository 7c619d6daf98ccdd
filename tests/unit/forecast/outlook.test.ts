import { describe, expect, it } from 'vitest';
import { assetOutlook, massDueKg, type GroupStatusSummary } from '@/lib/forecast';
import { fieldOf, utc } from './helpers';

const today = utc('2025-01-15');
const sound: GroupStatusSummary = { status: 'sound' };
const atNext: GroupStatusSummary = { status: 'proposed', dockingId: 'D1' };
const atLater: GroupStatusSummary = { status: 'proposed', dockingId: 'D2' };
const overdue: GroupStatusSummary = { status: 'no-docking', overdue: true, needsDockingBy: utc('2024-11-01') };
const needsDocking: GroupStatusSummary = { status: 'no-docking', overdue: false, needsDockingBy: utc('2025-04-01') };

describe('assetOutlook', () => {
  it('is sound when every group is sound', () => {
    expect(assetOutlook({ groupStatuses: [sound, sound], underProtectedBySurvey: false, today })).toBe('sound');
    expect(assetOutlook({ groupStatuses: [], underProtectedBySurvey: false, today })).toBe('sound');
  });

  it('an asset with no anodes recorded is not sound, but a survey finding still comes first', () => {
    expect(assetOutlook({ groupStatuses: [], underProtectedBySurvey: false, today, anodesRecorded: false })).toBe('no-anodes');
    expect(assetOutlook({ groupStatuses: [], underProtectedBySurvey: true, today, anodesRecorded: false })).toBe('under-protected');
    expect(assetOutlook({ groupStatuses: [], underProtectedBySurvey: false, overProtectedBySurvey: true, today, anodesRecorded: false })).toBe('over-protected');
    expect(assetOutlook({ groupStatuses: [sound], underProtectedBySurvey: false, today, anodesRecorded: true })).toBe('sound');
    expect(fieldOf(() => assetOutlook({ groupStatuses: [], underProtectedBySurvey: false, today, anodesRecorded: 'no' as unknown as boolean }))).toBe('anodesRecorded');
  });

  it('renew-at-next-docking for a renewal at the next docking, not for one at a later docking', () => {
    expect(assetOutlook({ groupStatuses: [sound, atNext], underProtectedBySurvey: false, today, nextDockingId: 'D1' })).toBe('renew-at-next-docking');
    expect(assetOutlook({ groupStatuses: [sound, atLater], underProtectedBySurvey: false, today, nextDockingId: 'D1' })).toBe('sound');
    // without nextDockingId any booked renewal counts
    expect(assetOutlook({ groupStatuses: [atLater], underProtectedBySurvey: false, today })).toBe('renew-at-next-docking');
    // a confirmed (kept) renewal at the next docking counts too
    expect(assetOutlook({ groupStatuses: [{ status: 'kept', dockingId: 'D1' }], underProtectedBySurvey: false, today, nextDockingId: 'D1' })).toBe('renew-at-next-docking');
  });

  it('a group needing an unplanned docking, not yet overdue, needs renewal at the next docking', () => {
    expect(assetOutlook({ groupStatuses: [needsDocking], underProtectedBySurvey: false, today, nextDockingId: 'D1' })).toBe('renew-at-next-docking');
  });

  it('overdue from the flag, or from a needsDockingBy that today has passed', () => {
    expect(assetOutlook({ groupStatuses: [atNext, overdue], underProtectedBySurvey: false, today })).toBe('overdue');
    // computed earlier as not overdue; by 2025-05-01 its date 2025-04-01 has passed
    expect(assetOutlook({ groupStatuses: [needsDocking], underProtectedBySurvey: false, today: utc('2025-05-01') })).toBe('overdue');
  });

  it('precedence: under-protected > overdue > renew-at-next-docking > sound', () => {
    expect(assetOutlook({ groupStatuses: [sound, atNext, overdue], underProtectedBySurvey: true, today })).toBe('under-protected');
    expect(assetOutlook({ groupStatuses: [sound], underProtectedBySurvey: true, today })).toBe('under-protected');
    expect(assetOutlook({ groupStatuses: [atNext, overdue, sound], underProtectedBySurvey: false, today })).toBe('overdue');
    expect(assetOutlook({ groupStatuses: [sound, atNext], underProtectedBySurvey: false, today })).toBe('renew-at-next-docking');
  });

  it('over-protected by survey is an outlook of its own, after under-protection and before overdue', () => {
    expect(assetOutlook({ groupStatuses: [sound], underProtectedBySurvey: false, overProtectedBySurvey: true, today })).toBe('over-protected');
    expect(assetOutlook({ groupStatuses: [atNext, overdue], underProtectedBySurvey: false, overProtectedBySurvey: true, today })).toBe('over-protected');
    // both found in the same survey: under-protection keeps precedence
    expect(assetOutlook({ groupStatuses: [sound], underProtectedBySurvey: true, overProtectedBySurvey: true, today })).toBe('under-protected');
    expect(assetOutlook({ groupStatuses: [sound], underProtectedBySurvey: false, overProtectedBySurvey: false, today })).toBe('sound');
    expect(fieldOf(() => assetOutlook({ groupStatuses: [], underProtectedBySurvey: false, overProtectedBySurvey: 'yes' as unknown as boolean, today }))).toBe('overProtectedBySurvey');
  });

  it('rejects a missing survey flag', () => {
    expect(fieldOf(() => assetOutlook({ groupStatuses: [], underProtectedBySurvey: undefined as unknown as boolean, today }))).toBe('underProtectedBySurvey');
  });
});

describe('massDueKg', () => {
  it('sums the net mass of the groups renewed at each docking (proposed and kept), in docking order', () => {
    // invented: stern 6 x 10 kg = 60 kg and rudder 2 x 4.5 kg = 9 kg at D1; hull 20 x 10 kg = 200 kg at D2
    const due = massDueKg(
      [
        { groupId: 'stern', status: 'proposed', dockingId: 'D1' },
        { groupId: 'hull', status: 'proposed', dockingId: 'D2' },
        { groupId: 'rudder', status: 'kept', dockingId: 'D1' },
        { groupId: 'seachest', status: 'sound' },
        { groupId: 'bow', status: 'no-docking' },
      ],
      { stern: 60, hull: 200, rudder: 9, seachest: 5, bow: 30 },
    );
    expect(due).toEqual([
      { dockingId: 'D1', massKg: 69, groupIds: ['stern', 'rudder'] },
      { dockingId: 'D2', massKg: 200, groupIds: ['hull'] },
    ]);
  });

  it('takes a Map and names a renewed group with no mass', () => {
    expect(massDueKg([{ groupId: 'a', status: 'proposed', dockingId: 'D1' }], new Map([['a', 12.5]]))).toEqual([{ dockingId: 'D1', massKg: 12.5, groupIds: ['a'] }]);
    expect(fieldOf(() => massDueKg([{ groupId: 'a', status: 'proposed', dockingId: 'D1' }], {}))).toBe('netMassKgByGroup.a');
  });
});
