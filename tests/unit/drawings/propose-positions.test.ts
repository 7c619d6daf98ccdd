import { describe, expect, it } from 'vitest';
import { HULL_ANODE_SPACING_M, STERN_SHARE, proposePositions } from '@/lib/drawings/propose-positions';
import { pilesCovered } from '@/lib/drawings/pile-plan';

// An invented ro-pax ferry (Lpp 96 m, T 4.6 m, frames 0.6 m) and an invented jetty of 4 rows by 12 bents.
const ferry = { kind: 'vessel' as const, lengthBppM: 96, draughtM: 4.6, frameSpacingM: 0.6 };
const jetty = { kind: 'structure' as const, pileCount: 48, pileRows: 4, pileBents: 12 };

describe('placement proposal', () => {
  it('spreads the bottom anodes about 6 m apart on each side and puts a fifth of them towards the stern', () => {
    const [bottom] = proposePositions(ferry, [{ name: 'Hull bottom', kind: 'hull-bottom', count: 22 }]);
    // 11 a side, 10 gaps of 6 m = 60 m = 100 frames of 0.6 m, centred on 0.08-0.92 L. // design basis, practice
    expect(bottom!.position.frameTo! - bottom!.position.frameFrom!).toBe(100);
    expect((bottom!.position.frameFrom! + bottom!.position.frameTo!) / 2).toBeCloseTo((0.5 * 96) / 0.6, 0);
    expect(bottom!.position.side).toBe('both');
    expect(bottom!.position.place).toBe('hull-bottom');
    expect(HULL_ANODE_SPACING_M).toBe(6); // design basis: about 6 m apart (practice)
    expect(STERN_SHARE).toBeGreaterThanOrEqual(0.15); // design basis: 15-20 % at stern and rudder (practice)
    expect(bottom!.text).toContain(`${Math.round(22 * STERN_SHARE)} of them within Fr`);
    expect(bottom!.basis).toMatch(/design basis, practice/);
  });

  it('never proposes more length than the hull has', () => {
    const [sides] = proposePositions(ferry, [{ name: 'Sides', kind: 'boot-top-sides', count: 200 }]);
    expect(sides!.position.frameFrom).toBe(Math.round((0.1 * 96) / 0.6));
    expect(sides!.position.frameTo).toBe(Math.round((0.95 * 96) / 0.6));
  });

  it('places the stern appendages clear of the propeller tips, and skips zones without anodes', () => {
    const out = proposePositions(ferry, [
      { name: 'Rudder', kind: 'rudder', count: 2 },
      { name: 'Propeller and shaft', kind: 'propeller-shaft', count: 6 },
      { name: 'Sea chests', kind: 'sea-chest', count: 0 },
    ]);
    expect(out.map((p) => p.zone)).toEqual(['Rudder', 'Propeller and shaft']);
    expect(out[0]!.position).toMatchObject({ place: 'rudder', side: 'both' });
    expect(out[1]!.position).toMatchObject({ place: 'propeller-shaft', end: 'aft', note: 'clear of propeller tips' });
  });

  it('shares a structure zone evenly over every pile of the grid', () => {
    const [immersed, mud] = proposePositions(jetty, [
      { name: 'Piles immersed', kind: 'pile-immersed', count: 48 },
      { name: 'Piles mud', kind: 'pile-mud', count: 30 },
    ]);
    expect(pilesCovered(immersed!.position, { rows: 4, bents: 12 })).toHaveLength(48);
    expect(immersed!.text).toBe('B1-A to B12-D, 1 per pile');
    expect(mud!.text).toBe('B1-A to B12-D, 30 over 48 piles, evenly, below the mudline');
    expect(immersed!.basis).toMatch(/common practice/);
  });
});

describe('placement proposal from estimated or missing particulars', () => {
  it('says in the text and in the hint when the frames come from an estimated spacing', () => {
    // No frame spacing entered: 0.002 × 96 + 0.48 = 0.672 m.
    const [bottom, sides] = proposePositions({ kind: 'vessel', lengthBppM: 96, draughtM: 4.6, frameSpacingM: null }, [
      { name: 'Hull bottom', kind: 'hull-bottom', count: 22 },
      { name: 'Sides', kind: 'boot-top-sides', count: 10 },
    ]);
    for (const p of [bottom!, sides!]) {
      expect(p.text).toContain('frames from an estimated 0.67 m spacing: check the frame plan');
      expect(p.basis).toMatch(/estimated 0\.67 m spacing.*check the frame plan/);
      // The warning stays with the position as its note.
      expect(p.position.note).toContain('frames from an estimated 0.67 m spacing');
    }
    // A spacing on record that is itself an estimate says so too; an entered one does not.
    const [marked] = proposePositions({ ...ferry, frameSpacingSource: 'estimate' }, [{ name: 'Hull bottom', kind: 'hull-bottom', count: 22 }]);
    expect(marked!.text).toContain('frames from an estimated 0.6 m spacing: check the frame plan');
    const [entered] = proposePositions({ ...ferry, frameSpacingSource: 'entered' }, [{ name: 'Hull bottom', kind: 'hull-bottom', count: 22 }]);
    expect(entered!.text).not.toContain('estimated');
  });

  it('proposes no piles when the grid is not known, nor on a sheet-pile wall or a pontoon', () => {
    const zones = [{ name: 'Piles immersed', kind: 'pile-immersed', count: 24 }];
    const cases = [
      { asset: { kind: 'structure' as const, pileCount: 48, pileRows: null, pileBents: null }, basis: /pile grid is not known/ },
      { asset: { kind: 'structure' as const, pileCount: 48, pileRows: 2, pileBents: 24, pileGridSource: 'estimate' as const }, basis: /pile grid is not known/ },
      { asset: { kind: 'structure' as const, structureType: 'sheet-pile-wall', pileCount: null }, basis: /sheet-pile wall.*chainage/ },
      { asset: { kind: 'structure' as const, structureType: 'pontoon', pileCount: null }, basis: /pontoon has no pile grid/ },
    ];
    for (const { asset, basis } of cases) {
      const [p] = proposePositions(asset, zones);
      expect(p!.text).toBe('');
      expect(p!.position.pileFrom).toBeNull();
      expect(p!.basis).toMatch(basis);
    }
  });
});

describe('placement proposal against the design basis (line 64)', () => {
  it('puts 15-20 % of all the hull’s anodes at the stern and rudder, counting the rudder and stern-frame zones', () => {
    // 40 anodes in all: 20 % is 8 at the stern; the rudder (2) and the stern frame (4) have 6, so 2 more in the bottom's aft quarter.
    const out = proposePositions(ferry, [
      { name: 'Hull bottom', kind: 'hull-bottom', count: 30 },
      { name: 'Rudder', kind: 'rudder', count: 2 },
      { name: 'Propeller and shaft', kind: 'propeller-shaft', count: 4 },
      { name: 'Sides', kind: 'boot-top-sides', count: 4 },
    ]);
    const bottom = out.find((p) => p.zone === 'Hull bottom')!;
    expect(bottom.text).toMatch(/, 2 of them within Fr \d+-40(;|$)/); // aft quarter: 0.25 × 96 m / 0.6 m = frame 40
    expect(bottom.basis).toMatch(/20 % of the hull's 40 anodes at the stern and rudder/);
    expect(bottom.basis).toContain("the rudder and stern-frame zones hold 6, and 2 of the bottom's go in its aft quarter to make it up");
    // Enough at the stern already: none added to the bottom's aft part.
    const [rich] = proposePositions(ferry, [
      { name: 'Hull bottom', kind: 'hull-bottom', count: 20 },
      { name: 'Rudder', kind: 'rudder', count: 6 },
    ]);
    expect(rich!.text).not.toContain('of them within');
    expect(rich!.basis).toContain("the rudder and stern-frame zones hold 6, enough without adding any of the bottom's at the stern");
    // One short: the one goes aft, and the proposal places it (not only the basis).
    const [oneShort] = proposePositions(ferry, [
      { name: 'Hull bottom', kind: 'hull-bottom', count: 26 },
      { name: 'Rudder', kind: 'rudder', count: 5 },
    ]);
    expect(oneShort!.text).toMatch(/, 1 of them within Fr \d+-40(;|$)/); // 20 % of 31 is 6; the rudder holds 5
    expect(oneShort!.basis).toContain("the rudder and stern-frame zones hold 5, and 1 of the bottom's goes in its aft quarter");
    // A bottom too small to make up the share: said so, never "made up".
    const [tooFew] = proposePositions(ferry, [
      { name: 'Hull bottom', kind: 'hull-bottom', count: 2 },
      { name: 'Sides', kind: 'boot-top-sides', count: 38 },
    ]);
    expect(tooFew!.basis).toContain('and 2 of the 8 still needed come from the bottom, in its aft quarter (the bottom has no more)');
  });

  it('states the fuel-tank caution and marks the heights as assumptions', () => {
    const [bottom, sides] = proposePositions(ferry, [
      { name: 'Hull bottom', kind: 'hull-bottom', count: 10 },
      { name: 'Sides', kind: 'boot-top-sides', count: 10 },
    ]);
    for (const p of [bottom!, sides!]) {
      expect(p.basis).toContain('Not over fuel tanks if the anodes are welded');
      expect(p.basis).toContain('The height is an assumption (not in the design basis)');
    }
  });

  it('makes up no frames for a zone of another kind', () => {
    const [other] = proposePositions(ferry, [{ name: 'Bow doors', kind: 'other', count: 4 }]);
    expect(other!.text).toBe('');
    expect(other!.position.frameFrom).toBeNull();
    expect(other!.basis).toMatch(/No position proposed/);
  });
});
