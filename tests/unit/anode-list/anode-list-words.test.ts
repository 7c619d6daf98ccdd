import { describe, expect, it } from 'vitest';
import { anodeListOccasion, anodeListWords, buildAnodeList, dimensionsWords, dockingKindWords } from '@/lib/anode-list';
import { BUILTIN_ANODE_MODELS } from '@/lib/cp';
import { fieldOf, smallInput } from './helpers';

describe('anode list words follow the asset and the work', () => {
  it("a vessel's dry-docking is the yard's: dry-dock list, yard, docking reference", () => {
    const w = anodeListWords('vessel', 'intermediate');
    expect(w).toMatchObject({ occasion: 'docking', title: 'Dry-dock anode list', worksBy: 'Yard', fittedBy: 'Fitted by (yard)', occasionTitle: 'Docking', assetTitle: 'Vessel' });
  });

  it("a jetty's campaign is the diving contractor's, whatever it is booked as", () => {
    for (const kind of ['campaign', 'intermediate']) {
      const w = anodeListWords('structure', kind);
      expect(w).toMatchObject({ occasion: 'campaign', title: 'Anode list, diving campaign', worksBy: 'Contractor', fittedBy: 'Fitted by (contractor)', occasionTitle: 'Campaign', assetTitle: 'Structure' });
      expect(Object.values(w).join(' ')).not.toMatch(/yard|dry-dock|docking/i);
    }
  });

  it("a vessel's in-water campaign uses the contractor's words too", () => {
    expect(anodeListOccasion('vessel', 'campaign')).toBe('campaign');
    expect(dockingKindWords('campaign')).toBe('Diving campaign');
    expect(dockingKindWords('renewal-survey')).toBe('Renewal survey docking');
  });

  it('the built list carries its words', () => {
    expect(buildAnodeList(smallInput()).words.title).toBe('Dry-dock anode list');
  });
});

describe('dimensionsWords', () => {
  it('writes a plate as length × width × thickness in mm', () => {
    expect(dimensionsWords({ lengthM: 0.4, widthM: 0.2, thicknessM: 0.06 })).toBe('400 × 200 × 60');
  });

  it('writes a rod as length × Ø diameter, and a bracelet with its inside diameter', () => {
    expect(dimensionsWords({ lengthM: 1.5, radiusM: 0.1 })).toBe('1500 × Ø200');
    expect(dimensionsWords({ lengthM: 0.3, thicknessM: 0.05, innerDiameterM: 0.61 })).toBe('300 × 50, ID 610');
  });

  it('writes a dash when the catalogue has no dimensions', () => {
    expect(dimensionsWords(null)).toBe('–');
  });

  it('writes every built-in model with its length first', () => {
    for (const m of BUILTIN_ANODE_MODELS) expect(dimensionsWords(m.dimensions)).toMatch(new RegExp(`^${Math.round(m.dimensions.lengthM * 1000)} × `));
  });
});

describe('buildAnodeList: dimensions and signer', () => {
  it('keeps each line\'s and each ordering line\'s dimensions, and the preparer\'s role', () => {
    const input = smallInput();
    input.renewals = input.renewals.map((r) => ({ ...r, dimensions: r.designation === 'TW-AW-4020' ? { lengthM: 0.4, widthM: 0.2, thicknessM: 0.06 } : null }));
    input.revision = { ...input.revision, preparedByRole: 'Planner' };
    const list = buildAnodeList(input);
    expect(list.orderTotals.find((o) => o.designation === 'TW-AW-4020')!.dimensions).toEqual({ lengthM: 0.4, widthM: 0.2, thicknessM: 0.06 });
    expect(list.orderTotals.find((o) => o.designation === 'TW-ZB-2510')!.dimensions).toBeNull();
    expect(list.revision.preparedByRole).toBe('Planner');
  });

  it('refuses a dimension that is not a positive number, naming it', () => {
    const input = smallInput();
    input.renewals[1] = { ...input.renewals[1], dimensions: { lengthM: 0.4, widthM: -1 } };
    expect(fieldOf(() => buildAnodeList(input))).toBe('renewals[1].dimensions.widthM');
  });
});
