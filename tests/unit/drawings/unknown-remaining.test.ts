import { describe, expect, it } from 'vitest';
import { fillSymbol } from '@/lib/drawings/shapes';
import { pilePlanView, pileStates } from '@/lib/drawings/pile-plan';
import { parsePosition } from '@/lib/drawings/parse-position';
import { buildAssetDrawing } from '@/lib/drawings/asset-drawing';
import { ROLE_STYLES } from '@/components/drawings/drawing-svg';

describe('an anode whose remaining fraction is not known', () => {
  it('is drawn as a dashed outline with "?", never as the empty outline of a used-up anode', () => {
    const unknown = fillSymbol(0, 0, 9, 7, null);
    const usedUp = fillSymbol(0, 0, 9, 7, 0);
    expect(unknown.map((s) => s.role)).toEqual(['anode-unknown', 'anode-unknown-mark']);
    expect(unknown.find((s) => s.kind === 'text')).toMatchObject({ text: '?' });
    expect(usedUp.map((s) => s.role)).toContain('anode');
    expect(usedUp.map((s) => s.role)).not.toContain('anode-unknown');
    // In grey print the outline differs by its dashes, not by a colour.
    expect(ROLE_STYLES['anode-unknown'].strokeDasharray).toBeTruthy();
    expect(ROLE_STYLES.anode.strokeDasharray).toBeUndefined();
    expect(ROLE_STYLES.pile.strokeDasharray).toBeUndefined();
  });

  it('on the pile plan differs from a pile without anodes, and the key says so', () => {
    const grid = { rows: 2, bents: 3 };
    const states = pileStates(grid, [{ id: 'g', label: 'No forecast', quantity: 2, position: parsePosition('bent 1 row A'), remainingFraction: null }], []);
    const plan = pilePlanView('Plan', grid, states);
    const roles = (target: string) => plan.groups.find((g) => g.target === target)!.shapes.map((s) => s.role);
    expect(roles('pile-1-A')).toEqual(['anode-unknown', 'anode-unknown-mark']);
    expect(roles('pile-2-A')).toEqual(['pile']);
    const { drawing } = buildAssetDrawing({ kind: 'structure', name: 'Key Jetty', pileCount: 6, pileRows: 2, pileBents: 3 } as never, [{ id: 'g', label: 'No forecast', quantity: 2, position: parsePosition('bent 1 row A'), remainingFraction: null }], []);
    expect(drawing!.key.map((k) => k.role)).toEqual(expect.arrayContaining(['pile', 'anode', 'anode-unknown']));
    expect(drawing!.key.find((k) => k.role === 'anode-unknown')!.label).toMatch(/not known.*dashed outline with "\?"/);
  });
});

describe('a large pile grid', () => {
  it('is drawn in part, at most 30 rows by 60 bents, and the notes say so', () => {
    const groups = [{ id: 'g', label: 'All', quantity: 400, position: parsePosition('B1-A to B100-D', 'structure'), remainingFraction: 0.5 }];
    const { drawing } = buildAssetDrawing({ kind: 'structure', name: 'Long Wharf', pileCount: 400, pileRows: 4, pileBents: 100 } as never, groups, []);
    expect(drawing!.views[0]!.groups).toHaveLength(4 * 60);
    expect(drawing!.views[0]!.title).toBe('Plan: 4 rows × 100 bents (first 4 × 60 drawn)');
    expect(drawing!.notes.some((n) => n.startsWith('The plan draws the first 4 rows and 60 bents of the 4 × 100 grid'))).toBe(true);
    // A grid within the cap is drawn whole, with no such note.
    const small = buildAssetDrawing({ kind: 'structure', name: 'Short Jetty', pileCount: 8, pileRows: 2, pileBents: 4 } as never, [], []).drawing!;
    expect(small.views[0]!.groups).toHaveLength(8);
    expect(small.notes.some((n) => n.startsWith('The plan draws the first'))).toBe(false);
  });
});
