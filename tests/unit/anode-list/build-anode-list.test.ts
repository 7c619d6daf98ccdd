import { describe, expect, it } from 'vitest';
import { AnodeListInputError, FITTING_NOTES, buildAnodeList, fittingNotesFor } from '@/lib/anode-list';
import { fieldOf, smallInput, smallRenewals } from './helpers';

describe('buildAnodeList: zones, subtotals and totals', () => {
  const list = buildAnodeList(smallInput());

  it('keeps zones in the order of their first line, with lines without a zone under null', () => {
    expect(list.zones.map((z) => z.zone)).toEqual(['Hull bottom', 'Rudder', null]);
  });

  it('sorts the lines of a zone by group label in natural order (P2 before P10)', () => {
    expect(list.zones[0].lines.map((l) => l.groupLabel)).toEqual(['Bottom P2', 'Bottom P10', 'Bottom S2']);
  });

  it('gives each line its totals as quantity x each', () => {
    const p10 = list.zones[0].lines[1];
    expect(p10.netMassTotalKg).toBe(92.4); // 12 x 7.7 (exactly 92.4 after rounding float noise)
    expect(p10.grossMassTotalKg).toBe(104.4); // 12 x 8.7
  });

  it('totals each zone', () => {
    // Hull bottom: 10 + 12 + 8 = 30 anodes; net 77.0 + 92.4 + 78.4 = 247.8 kg; gross 87.0 + 104.4 + 88.0 = 279.4 kg
    expect(list.zones[0].subtotal).toEqual({ quantity: 30, netMassKg: 247.8, grossMassKg: 279.4 });
    // Rudder: 4 x 4.7 = 18.8 kg net, 4 x 5.0 = 20.0 kg gross
    expect(list.zones[1].subtotal).toEqual({ quantity: 4, netMassKg: 18.8, grossMassKg: 20 });
    // No zone: 6 x 4.7 = 28.2 kg net, 6 x 5.0 = 30.0 kg gross
    expect(list.zones[2].subtotal).toEqual({ quantity: 6, netMassKg: 28.2, grossMassKg: 30 });
  });

  it('gives the grand totals', () => {
    // 30 + 4 + 6 = 40 anodes; net 247.8 + 18.8 + 28.2 = 294.8 kg; gross 279.4 + 20.0 + 30.0 = 329.4 kg
    expect(list.totals).toEqual({ quantity: 40, netMassKg: 294.8, grossMassKg: 329.4 });
    expect(list.lineCount).toBe(5);
  });

  it('totals by model for ordering, sorted by designation', () => {
    expect(list.orderTotals).toEqual([
      // TW-AW-4020: 12 + 10 = 22 anodes; 22 x 7.7 = 169.4 kg net; 22 x 8.7 = 191.4 kg gross
      { designation: 'TW-AW-4020', alloy: 'al-zn-in', mounting: 'flush-weld', quantity: 22, netMassEachKg: 7.7, grossMassEachKg: 8.7, netMassTotalKg: 169.4, grossMassTotalKg: 191.4, dimensions: null },
      // TW-AW-6512: 8 x 9.8 = 78.4 kg net; 8 x 11.0 = 88.0 kg gross
      { designation: 'TW-AW-6512', alloy: 'al-zn-in', mounting: 'flush-weld', quantity: 8, netMassEachKg: 9.8, grossMassEachKg: 11, netMassTotalKg: 78.4, grossMassTotalKg: 88, dimensions: null },
      // TW-ZB-2510: 4 + 6 = 10 anodes; 47.0 kg net; 50.0 kg gross
      { designation: 'TW-ZB-2510', alloy: 'zinc', mounting: 'flush-bolt', quantity: 10, netMassEachKg: 4.7, grossMassEachKg: 5, netMassTotalKg: 47, grossMassTotalKg: 50, dimensions: null },
    ]);
    // The ordering totals add up to the grand totals: 169.4 + 78.4 + 47.0 = 294.8 kg.
    expect(list.orderTotals.reduce((s, o) => s + o.quantity, 0)).toBe(list.totals.quantity);
  });

  it('warns that proposed lines are not confirmed yet', () => {
    expect(list.warnings).toEqual(['1 of 5 lines is still proposed, not confirmed: confirm it before ordering.']);
  });

  it('orders a model booked with different masses on separate lines, and warns', () => {
    const renewals = smallRenewals();
    renewals[2] = { ...renewals[2], netMassKg: 7.5 }; // the catalogue entry was edited between bookings
    const mixed = buildAnodeList(smallInput({ renewals }));
    expect(mixed.orderTotals.filter((o) => o.designation === 'TW-AW-4020').map((o) => [o.netMassEachKg, o.quantity])).toEqual([
      [7.5, 10],
      [7.7, 12],
    ]);
    expect(mixed.warnings[0]).toMatch(/^Model TW-AW-4020 is booked with different data/);
  });

  it('accepts a docking with no renewals (an empty list still prints)', () => {
    const empty = buildAnodeList(smallInput({ renewals: [] }));
    expect(empty.zones).toEqual([]);
    expect(empty.totals).toEqual({ quantity: 0, netMassKg: 0, grossMassKg: 0 });
    expect(empty.orderTotals).toEqual([]);
    expect(empty.warnings).toEqual([]);
  });

  it('fills the optional docking and revision fields with null', () => {
    expect(list.docking.actualStart).toBeNull();
    expect(list.revision).toMatchObject({ checkedBy: null, checkedAt: null, approvedBy: null, approvedAt: null });
  });
});

describe('buildAnodeList: fitting notes', () => {
  it("gives a vessel's dry-docking with welded and bolted anodes every docking note and no diving note", () => {
    expect(buildAnodeList(smallInput()).fittingNotes).toEqual(FITTING_NOTES.filter((n) => n.work !== 'campaign').map((n) => n.text));
  });

  it("gives a jetty's diving campaign diving notes, and no blasting, painting or propeller note", () => {
    const input = smallInput({ asset: { name: 'North Jetty', kind: 'structure', particulars: [] } });
    input.docking = { ...input.docking, kind: 'campaign', yard: 'Deepline Diving' };
    const notes = buildAnodeList(input).fittingNotes.join(' ');
    expect(notes).toMatch(/dive plan/);
    expect(notes).toMatch(/wet-welding procedure/);
    expect(notes).toMatch(/photograph or video/);
    expect(notes).not.toMatch(/blast|paint|overspray|propeller/i);
  });

  it('leaves out the propeller note for a structure and the bolt note when nothing is bolted', () => {
    const notes = fittingNotesFor('structure', ['pile-mounted']);
    expect(notes.some((n) => /propeller/.test(n))).toBe(false);
    expect(notes.some((n) => /Bolt-on/.test(n))).toBe(false);
    expect(notes.some((n) => /Weld-on/.test(n))).toBe(true);
  });

  it('says to mask and not paint anodes, to measure continuity without inventing a limit, and to record what was fitted', () => {
    const all = FITTING_NOTES.filter((n) => n.work !== 'campaign').map((n) => n.text).join(' ');
    expect(all).toMatch(/Mask every anode face/);
    expect(all).toMatch(/take the masking off/);
    expect(all).toMatch(/Never paint/);
    expect(all).toMatch(/measure continuity to the hull after fitting/);
    expect(all).toMatch(/fuel tanks .*\(common practice\)/);
    expect(all).toMatch(/propeller blade tips.*flow lines \(common practice\)/);
    expect(all).toMatch(/back in Tidewarden/);
    // No acceptance value in ohms is stated anywhere.
    expect(all).not.toMatch(/ohm|Ω|\d\s*m?Ω/i);
  });
});

describe('buildAnodeList: invalid input throws AnodeListInputError naming the field', () => {
  const withLine = (i: number, patch: Record<string, unknown>) => {
    const renewals = smallRenewals() as unknown as Record<string, unknown>[];
    renewals[i] = { ...renewals[i], ...patch };
    return smallInput({ renewals: renewals as never });
  };

  it.each([0, -3, 2.5, Number.NaN, Number.POSITIVE_INFINITY, '4', null])('quantity %s', (quantity) => {
    expect(fieldOf(() => buildAnodeList(withLine(1, { quantity })))).toBe('renewals[1].quantity');
  });

  it.each([0, -7.7, Number.NaN, Number.POSITIVE_INFINITY, '7.7', undefined])('net mass %s', (netMassKg) => {
    expect(fieldOf(() => buildAnodeList(withLine(3, { netMassKg })))).toBe('renewals[3].netMassKg');
  });

  it.each([0, Number.NEGATIVE_INFINITY, Number.NaN])('gross mass %s', (grossMassKg) => {
    expect(fieldOf(() => buildAnodeList(withLine(0, { grossMassKg })))).toBe('renewals[0].grossMassKg');
  });

  it('a gross mass below the net mass', () => {
    expect(fieldOf(() => buildAnodeList(withLine(0, { grossMassKg: 7 })))).toBe('renewals[0].grossMassKg');
  });

  it('an unknown alloy, mounting or status, and an empty designation', () => {
    expect(fieldOf(() => buildAnodeList(withLine(2, { alloy: 'bronze' })))).toBe('renewals[2].alloy');
    expect(fieldOf(() => buildAnodeList(withLine(2, { mounting: 'glued' })))).toBe('renewals[2].mounting');
    expect(fieldOf(() => buildAnodeList(withLine(2, { status: 'cancelled' })))).toBe('renewals[2].status');
    expect(fieldOf(() => buildAnodeList(withLine(2, { designation: '  ' })))).toBe('renewals[2].designation');
  });

  it('a renew-by date that is not a real day written YYYY-MM-DD; a missing or null one is none', () => {
    expect(fieldOf(() => buildAnodeList(withLine(1, { renewBy: '2027-02-30' })))).toBe('renewals[1].renewBy');
    expect(fieldOf(() => buildAnodeList(withLine(1, { renewBy: '9 Nov 2027' })))).toBe('renewals[1].renewBy');
    const list = buildAnodeList(withLine(1, { renewBy: '2027-11-09' }));
    expect(list.zones.flatMap((z) => z.lines).map((l) => [l.groupLabel, l.renewBy])).toEqual([
      ['Bottom P2', null],
      ['Bottom P10', null],
      ['Bottom S2', null],
      ['Rudder', '2027-11-09'],
      ['Sea chest grid', null],
    ]);
    expect(buildAnodeList(withLine(1, { renewBy: null })).zones[1].lines[0].renewBy).toBeNull();
  });

  it('docking dates that are not real days, or an end before the start', () => {
    const docking = smallInput().docking;
    expect(fieldOf(() => buildAnodeList(smallInput({ docking: { ...docking, plannedStart: '2027-02-30' } })))).toBe('docking.plannedStart');
    expect(fieldOf(() => buildAnodeList(smallInput({ docking: { ...docking, plannedStart: '3 May 2027' } })))).toBe('docking.plannedStart');
    expect(fieldOf(() => buildAnodeList(smallInput({ docking: { ...docking, plannedEnd: '2027-05-01' } })))).toBe('docking.plannedEnd');
  });

  it('a revision number that is not a positive whole number, and an invalid date', () => {
    const revision = smallInput().revision;
    expect(fieldOf(() => buildAnodeList(smallInput({ revision: { ...revision, number: 0 } })))).toBe('revision.number');
    expect(fieldOf(() => buildAnodeList(smallInput({ revision: { ...revision, preparedAt: new Date('nonsense') } })))).toBe('revision.preparedAt');
  });

  it('is a typed error with a readable message', () => {
    try {
      buildAnodeList(withLine(1, { quantity: 0 }));
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(AnodeListInputError);
      expect((e as Error).name).toBe('AnodeListInputError');
      expect((e as Error).message).toBe('renewals[1].quantity must be a whole number of at least 1 (got 0).');
    }
  });
});
