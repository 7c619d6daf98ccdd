import { describe, expect, it } from 'vitest';
import { HULL_DRAWING_WIDTH, MAX_SYMBOLS, estimatedFrameSpacingM, frameSpacingOf, groupSymbols, hullScale, hullView, inView, toDrawing, frameToMetres, type DrawnGroup } from '@/lib/drawings/hull-drawing';
import { gridPiles, pileCentre, pileGridOf, pilePlanView, pileStates, pilesCovered, pileElevationView } from '@/lib/drawings/pile-plan';
import { parsePosition } from '@/lib/drawings/parse-position';
import type { Shape } from '@/lib/drawings/shapes';

// An invented ro-pax ferry: Lpp 96 m, B 18.6 m, T 4.6 m.
const ferry = { lengthBppM: 96, beamM: 18.6, draughtM: 4.6, blockCoefficient: 0.62, frameSpacingM: null };
const group = (id: string, quantity: number, position: string, remainingFraction: number | null): DrawnGroup => ({ id, label: id, quantity, position: parsePosition(position), remainingFraction });
const rects = (shapes: Shape[], role: Shape['role']) => shapes.filter((s): s is Extract<Shape, { kind: 'rect' }> => s.kind === 'rect' && s.role === role);

describe('frames to drawing coordinates', () => {
  it('estimates the frame spacing from the length, 0.002 L + 0.48 m, unless it is entered', () => {
    expect(estimatedFrameSpacingM(96)).toBe(0.67); // 0.002 × 96 + 0.48 = 0.672 // common practice
    expect(estimatedFrameSpacingM(150)).toBe(0.78); // common practice
    expect(frameSpacingOf(ferry)).toEqual({ spacingM: 0.67, source: 'estimate' });
    expect(frameSpacingOf({ ...ferry, frameSpacingM: 0.6 })).toEqual({ spacingM: 0.6, source: 'entered' });
  });

  it('puts frame 0 at the aft perpendicular and counts forward at the spacing', () => {
    const scale = hullScale({ ...ferry, frameSpacingM: 0.6 });
    expect(frameToMetres(scale, 160)).toBeCloseTo(96, 6);
    const [ap] = toDrawing(scale, 'starboard', 0, 0);
    const [fp] = toDrawing(scale, 'starboard', frameToMetres(scale, 160), 0);
    // The drawing's width holds 1.08 L: the aft overhang (0.04 L) left of the aft perpendicular from starboard.
    expect(fp - ap).toBeCloseTo(96 * scale.sx, 0);
    expect(ap).toBeCloseTo(36 + 0.04 * 96 * scale.sx, 0);
  });

  it('mirrors the port view: the bow is to the left', () => {
    const scale = hullScale(ferry);
    for (const frame of [0, 40, 110]) {
      const [xs, ys] = toDrawing(scale, 'starboard', frameToMetres(scale, frame), 1.2);
      const [xp, yp] = toDrawing(scale, 'port', frameToMetres(scale, frame), 1.2);
      expect(xs + xp).toBeCloseTo(HULL_DRAWING_WIDTH, 0);
      expect(ys).toBe(yp);
    }
    const [a] = toDrawing(scale, 'port', frameToMetres(scale, 20), 0);
    const [b] = toDrawing(scale, 'port', frameToMetres(scale, 30), 0);
    expect(b).toBeLessThan(a);
  });

  it('draws heights upwards with a stated exaggeration, the keel lowest', () => {
    const scale = hullScale(ferry);
    expect(scale.exaggeration).toBeGreaterThan(1);
    expect(scale.sy).toBeCloseTo(scale.sx * scale.exaggeration, 6);
    const [, keel] = toDrawing(scale, 'starboard', 10, 0);
    const [, wl] = toDrawing(scale, 'starboard', 10, 4.6);
    expect(keel - wl).toBeCloseTo(4.6 * scale.sy, 0);
  });
});

describe('anode groups on the hull', () => {
  it('places a group between its frames at its height, half of a both-sides group on each side', () => {
    const scale = hullScale({ ...ferry, frameSpacingM: 0.6 });
    const g = group('Bottom', 22, 'Fr 20-130 P/S, 1.2 m above keel', 0.62);
    const drawn = groupSymbols(scale, 'starboard', g);
    const symbols = rects(drawn.shapes, 'anode');
    expect(symbols).toHaveLength(11);
    const [x20, y] = toDrawing(scale, 'starboard', 12, 1.2);
    const [x130] = toDrawing(scale, 'starboard', 78, 1.2);
    expect(symbols[0]!.x + symbols[0]!.w / 2).toBeCloseTo(x20, 0);
    expect(symbols[10]!.x + symbols[10]!.w / 2).toBeCloseTo(x130, 0);
    expect(symbols[0]!.y + symbols[0]!.h / 2).toBeCloseTo(y, 0);
    expect(drawn.title).toBe('Bottom: 11 anodes on this side, 62 % left');
  });

  it('fills each symbol to the remaining fraction and leaves it empty-outlined without a forecast', () => {
    const scale = hullScale(ferry);
    const drawn = groupSymbols(scale, 'port', group('Rudder', 2, 'rudder', 0.25));
    const outline = rects(drawn.shapes, 'anode')[0]!;
    const left = rects(drawn.shapes, 'anode-left')[0]!;
    expect(left.h).toBeCloseTo(outline.h * 0.25, 0);
    expect(left.y + left.h).toBeCloseTo(outline.y + outline.h, 0);
    expect(rects(groupSymbols(scale, 'port', group('Rudder', 2, 'rudder', null)).shapes, 'anode-left')).toHaveLength(0);
  });

  it(`draws at most ${MAX_SYMBOLS} symbols and says the count`, () => {
    const drawn = groupSymbols(hullScale(ferry), 'port', group('Hull', 40, 'Fr 6-60 P', 0.5));
    expect(rects(drawn.shapes, 'anode')).toHaveLength(MAX_SYMBOLS);
    expect(drawn.shapes.some((s) => s.kind === 'text' && s.text === `Hull · 40 (${MAX_SYMBOLS} drawn) · 50 % left`)).toBe(true);
  });

  it('shows a group only in the views of its side', () => {
    expect(inView(parsePosition('Fr 22-30 P'), 'port')).toBe(true);
    expect(inView(parsePosition('Fr 22-30 P'), 'starboard')).toBe(false);
    expect(inView(parsePosition('Fr 22-30 P/S'), 'starboard')).toBe(true);
    const groups = [group('P', 4, 'Fr 22-30 P', 0.5), group('S', 4, 'Fr 22-30 S', 0.5), group('Nowhere', 4, 'see drawing', 0.5)];
    expect(hullView(ferry, 'port', groups, []).groups.map((g) => g.target)).toEqual(['drawing-group-P']);
    expect(hullView(ferry, 'starboard', groups, []).groups.map((g) => g.target)).toEqual(['drawing-group-S']);
  });

  it('keeps every coordinate to one decimal', () => {
    const view = hullView(ferry, 'starboard', [group('Bottom', 22, 'Fr 20-130 P/S', 0.62)], [{ location: 'Fr 40 S', position: parsePosition('Fr 40 S'), words: '−0.96 V, protected' }]);
    const drawn = [...view.shapes, ...view.groups.flatMap((g) => g.shapes)].filter((s) => s.kind !== 'text');
    expect(drawn.length).toBeGreaterThan(20);
    const numbers = JSON.stringify(drawn).match(/-?\d+\.\d+/g) ?? [];
    expect(numbers.length).toBeGreaterThan(10);
    for (const n of numbers) expect(n.split('.')[1]!.length).toBeLessThanOrEqual(1);
  });
});

describe('pile grid layout', () => {
  const jettyTexts = ['B1-A to B6-D, one per pile at -4 m CD', 'B7-A to B12-D, one per pile at -4 m CD'].map((t) => parsePosition(t));

  it('takes entered rows and bents, or estimates them from the positions and the pile count', () => {
    expect(pileGridOf({ pileCount: 48, pileRows: 3, pileBents: 16 }, [])).toEqual({ rows: 3, bents: 16, source: 'entered' });
    expect(pileGridOf({ pileCount: 48, pileRows: null, pileBents: null }, jettyTexts)).toEqual({ rows: 4, bents: 12, source: 'estimate' });
    expect(pileGridOf({ pileCount: 6, pileRows: null, pileBents: null }, [])).toEqual({ rows: 2, bents: 3, source: 'estimate' });
  });

  it('lays bents left to right and rows top to bottom at even spacing', () => {
    const grid = { rows: 4, bents: 12 };
    expect(gridPiles(grid)).toHaveLength(48);
    const [xa1, ya1] = pileCentre(grid, 1, 'A');
    const [xa2] = pileCentre(grid, 2, 'A');
    const [xa12] = pileCentre(grid, 12, 'A');
    const [, yd1] = pileCentre(grid, 1, 'D');
    expect(xa2 - xa1).toBeGreaterThan(0);
    expect(Math.abs(xa12 - xa1 - 11 * (xa2 - xa1))).toBeLessThan(1); // rounded to 0.1 per pile
    expect(yd1 - ya1).toBe(120);
  });

  it('finds the piles a position covers', () => {
    const grid = { rows: 4, bents: 12 };
    const keys = (t: string) => pilesCovered(parsePosition(t), grid).map((p) => p.key);
    expect(keys('B1-A to B6-D')).toHaveLength(24);
    expect(keys('B1-A to B6-D')).toContain('6-D');
    expect(keys('B1-A to B6-D')).not.toContain('7-A');
    expect(keys('Bents 7-12, -3.5 m MLLW')).toHaveLength(24);
    expect(keys('row C')).toEqual(Array.from({ length: 12 }, (_, i) => `${i + 1}-C`));
    expect(keys('Pile B7 -2.0 m LAT')).toEqual(['7-B']);
    expect(keys('bent 3 row C')).toEqual(['3-C']);
    expect(keys('One bracelet per pile at -3 m CD')).toEqual([]);
  });

  it('shares a group’s anodes over its piles and fills each pile to its lowest remaining fraction', () => {
    const grid = { rows: 4, bents: 12 };
    const states = pileStates(grid, [group('Bents 1-6', 24, 'B1-A to B6-D, at -4 m CD', 0.45), group('Extra', 3, 'bent 1 row A, -2 m CD', 0.3)], [{ location: 'B1-A', position: parsePosition('B1-A'), words: '−0.98 V, protected' }]);
    const pile = (key: string) => states.find((s) => s.pile.key === key)!;
    expect(pile('1-A').groups.map((g) => g.anodes)).toEqual([1, 3]);
    expect(pile('1-A').remainingFraction).toBe(0.3);
    expect(pile('2-B').remainingFraction).toBe(0.45);
    expect(pile('7-A').groups).toEqual([]);
    expect(pile('1-A').readings).toHaveLength(1);
    const plan = pilePlanView('Plan', grid, states);
    expect(plan.groups).toHaveLength(48);
    expect(plan.groups.find((g) => g.target === 'pile-7-A')!.title).toBe('Pile bent 7 row A: no anodes recorded');
    expect(plan.groups.find((g) => g.target === 'pile-1-A')!.title).toBe('Pile bent 1 row A: 4 anodes, 30 % left; −0.98 V, protected');
    const elevation = pileElevationView(pile('1-A'));
    expect(elevation.groups.map((g) => g.title)).toEqual(['Bents 1-6: 1 on this pile, 45 % left', 'Extra: 3 on this pile, 30 % left']);
    // Deeper anodes are drawn lower.
    const yOf = (g: (typeof elevation.groups)[number]) => rects(g.shapes, 'anode')[0]!.y;
    expect(yOf(elevation.groups[0]!)).toBeGreaterThan(yOf(elevation.groups[1]!));
  });
});
