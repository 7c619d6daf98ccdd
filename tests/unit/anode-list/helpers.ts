import { expect } from 'vitest';
import { AnodeListInputError, type AnodeListInput, type AnodeListRenewalInput } from '@/lib/anode-list';

/**
 * A small invented list with hand-checkable totals (masses from the built-in catalogue):
 *   1. Hull bottom, Bottom P10, TW-AW-4020 12 x 7.7 / 8.7 kg  -> 92.4 / 104.4 kg
 *   2. Rudder,      Rudder,     TW-ZB-2510  4 x 4.7 / 5.0 kg  -> 18.8 /  20.0 kg
 *   3. Hull bottom, Bottom P2,  TW-AW-4020 10 x 7.7 / 8.7 kg  -> 77.0 /  87.0 kg
 *   4. (no zone),   Sea chest grid, TW-ZB-2510 6 x 4.7 / 5.0  -> 28.2 /  30.0 kg (proposed)
 *   5. Hull bottom, Bottom S2,  TW-AW-6512  8 x 9.8 / 11.0 kg -> 78.4 /  88.0 kg
 */
export function smallRenewals(): AnodeListRenewalInput[] {
  return [
    { zone: 'Hull bottom', groupLabel: 'Bottom P10', designation: 'TW-AW-4020', alloy: 'al-zn-in', mounting: 'flush-weld', quantity: 12, netMassKg: 7.7, grossMassKg: 8.7, positions: 'Fr 40-52 P, 1.0 m above keel', reason: 'forecast depletion', status: 'confirmed' },
    { zone: 'Rudder', groupLabel: 'Rudder', designation: 'TW-ZB-2510', alloy: 'zinc', mounting: 'flush-bolt', quantity: 4, netMassKg: 4.7, grossMassKg: 5, positions: 'Rudder blade, 2 each side', reason: 'survey finding', status: 'ordered' },
    { zone: 'Hull bottom', groupLabel: 'Bottom P2', designation: 'TW-AW-4020', alloy: 'al-zn-in', mounting: 'flush-weld', quantity: 10, netMassKg: 7.7, grossMassKg: 8.7, positions: 'Fr 8-20 P, 1.0 m above keel', reason: 'forecast depletion', status: 'confirmed' },
    { zone: null, groupLabel: 'Sea chest grid', designation: 'TW-ZB-2510', alloy: 'zinc', mounting: 'flush-bolt', quantity: 6, netMassKg: 4.7, grossMassKg: 5, positions: null, reason: 'damage', status: 'proposed' },
    { zone: 'Hull bottom', groupLabel: 'Bottom S2', designation: 'TW-AW-6512', alloy: 'al-zn-in', mounting: 'flush-weld', quantity: 8, netMassKg: 9.8, grossMassKg: 11, positions: 'Fr 8-20 S, 1.0 m above keel', reason: 'forecast depletion', status: 'confirmed' },
  ];
}

export function smallInput(overrides: Partial<AnodeListInput> = {}): AnodeListInput {
  return {
    organisation: { name: 'Pellworth Coastal Lines' },
    asset: {
      name: 'Morwenna Tide',
      kind: 'vessel',
      particulars: [
        ['Type', 'Passenger ferry'],
        ['Length between perpendiculars × beam × draught', '58 × 12.4 × 3.1 m'],
      ],
    },
    docking: { kind: 'intermediate', plannedStart: '2027-05-03', plannedEnd: '2027-05-10', yard: 'Saltmarsh Ship Repair, Dock 1', reference: 'PCL-27-05' },
    renewals: smallRenewals(),
    revision: { number: 1, preparedBy: 'Ada Rennick', preparedAt: new Date('2027-04-01T10:00:00Z'), checkedBy: null, approvedBy: null },
    printedAt: new Date('2027-04-02T09:00:00Z'),
    printedBy: 'Ada Rennick',
    ...overrides,
  };
}

/** Runs fn and returns the AnodeListInputError's field, or fails the test. */
export function fieldOf(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(AnodeListInputError);
    return (e as AnodeListInputError).field;
  }
  throw new Error('expected an AnodeListInputError, nothing was thrown');
}
