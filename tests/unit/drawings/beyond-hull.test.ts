import { describe, expect, it } from 'vitest';
import { buildAssetDrawing, BEYOND_HULL_WORDS } from '@/lib/drawings/asset-drawing';
import { parsePosition } from '@/lib/drawings/parse-position';

// An invented ferry: Lpp 96 m, frames 0.6 m apart (frame 160 at the forward perpendicular).
const ferry = { kind: 'vessel' as const, name: 'Beyond Ferry', lengthBppM: 96, beamM: 18, draughtM: 4.6, frameSpacingM: 0.6 };
const g = (id: string, text: string) => ({ id, label: id, quantity: 4, position: parsePosition(text, 'vessel'), remainingFraction: 0.5 });

describe('frames beyond the hull', () => {
  it('lists a group whose frames lie past the bow or the stern as beyond the hull, and does not draw it', () => {
    const { drawing } = buildAssetDrawing(ferry, [g('Far', 'Fr 400-410 P'), { ...g('Aft', 'S'), position: { ...parsePosition('S', 'vessel'), frameFrom: -40, frameTo: -40 } }, g('Inside', 'Fr 100-110 P')], []);
    const row = (id: string) => drawing!.rows.find((r) => r.id === id)!;
    expect(row('Far')).toMatchObject({ drawn: false, where: `Frames 400–410, port, ${BEYOND_HULL_WORDS}` });
    expect(row('Aft')).toMatchObject({ drawn: false });
    expect(row('Aft').where).toContain('beyond the hull (check the frame spacing)');
    expect(row('Inside')).toMatchObject({ drawn: true, where: 'Frames 100–110, port' });
    const targets = drawing!.views.flatMap((v) => v.groups.map((x) => x.target));
    expect(targets).toContain('drawing-group-Inside');
    expect(targets.some((t) => t.endsWith('Far') || t.endsWith('Aft'))).toBe(false);
    // Every coordinate drawn stays inside the view.
    for (const v of drawing!.views) for (const s of v.groups.flatMap((x) => x.shapes)) if (s.kind === 'rect') expect(s.x).toBeGreaterThanOrEqual(0), expect(s.x).toBeLessThanOrEqual(v.width);
  });
});

describe('the count a view shows', () => {
  it('says "side not given" for a group without a side, and rounding up for an odd count on both sides', () => {
    const { drawing } = buildAssetDrawing(ferry, [g('Rudder', 'rudder'), { ...g('Odd', 'Fr 20-130 P/S'), quantity: 21 }, g('Port only', 'Fr 30-40 P')], []);
    const titles = drawing!.views.flatMap((v) => v.groups.map((x) => x.title));
    expect(titles.filter((t) => t.startsWith('Rudder:'))).toEqual(['Rudder: 4 anodes, side not given (shown on both sides), 50 % left', 'Rudder: 4 anodes, side not given (shown on both sides), 50 % left']);
    expect(titles.filter((t) => t.startsWith('Odd:'))).toEqual(Array(2).fill('Odd: 21 anodes on both sides, 11 drawn on this side (an odd count, rounded up for symmetry), 50 % left'));
    expect(titles.filter((t) => t.startsWith('Port only:'))).toEqual(['Port only: 4 anodes on this side, 50 % left']);
  });
});
