import { describe, expect, it } from 'vitest';
import { parsePosition, formatPosition } from '@/lib/drawings/parse-position';
import { EMPTY_POSITION, anodePositionSchema, type AnodePosition } from '@/lib/schemas/anode-position';

// Position texts in the styles yards, planners and divers write them (all invented), and what they say as data.
const TABLE: [string, Partial<AnodePosition>][] = [
  ['Fr 22–30 P', { frameFrom: 22, frameTo: 30, side: 'port' }],
  ['frames 118 to 124 stbd, 1.2 m above keel', { frameFrom: 118, frameTo: 124, side: 'starboard', heightAboveKeelM: 1.2 }],
  ['rudder', { place: 'rudder' }],
  ['sea chest SB aft', { place: 'sea-chest', side: 'starboard', end: 'aft' }],
  ['bow thruster tunnel', { place: 'thruster-tunnel', end: 'fore' }],
  ['Pile B7 −2.0 m LAT', { pileFrom: { bent: 7, row: 'B' }, depthBelowDatumM: 2, datum: 'LAT' }],
  ['bent 3 row C, 1.5 m below MLWS', { pileFrom: { bent: 3, row: 'C' }, depthBelowDatumM: 1.5, datum: 'MLWS' }],
  ['Fr 6-60 P and S', { frameFrom: 6, frameTo: 60, side: 'both' }],
  ['Fr. 144-150 P/S, 2.5 m above keel', { frameFrom: 144, frameTo: 150, side: 'both', heightAboveKeelM: 2.5 }],
  ['FR 40 port side', { frameFrom: 40, frameTo: 40, side: 'port' }],
  ['Frame 12 to frame 18, starboard, bilge keel', { frameFrom: 12, frameTo: 18, side: 'starboard', place: 'hull-bottom' }],
  ['Fr 130-120 S', { frameFrom: 120, frameTo: 130, side: 'starboard' }],
  ['Rudder blade, both faces', { place: 'rudder', note: 'blade, both faces' }],
  ['stern frame and shaft brackets, clear of propeller tips', { place: 'propeller-shaft', end: 'aft', note: 'clear of propeller tips' }],
  ['Main sea chest gratings, port', { place: 'sea-chest', side: 'port', note: 'Main gratings' }],
  ['stern thruster tunnel, centreline', { place: 'thruster-tunnel', end: 'aft', side: 'centre' }],
  ['Boot-top Fr 60-90 SB 3.8 m above keel', { place: 'boot-top-sides', frameFrom: 60, frameTo: 90, side: 'starboard', heightAboveKeelM: 3.8 }],
  ['Flat bottom fr 30-110, CL', { place: 'hull-bottom', frameFrom: 30, frameTo: 110, side: 'centre' }],
  ['B1-A to B6-D, one per pile at -4 m CD', { pileFrom: { bent: 1, row: 'A' }, pileTo: { bent: 6, row: 'D' }, depthBelowDatumM: 4, datum: 'CD', note: 'one per pile' }],
  ['Piles C1 to C12, 2 m below low water', { pileFrom: { bent: 1, row: 'C' }, pileTo: { bent: 12, row: 'C' }, depthBelowDatumM: 2, datum: 'LW' }],
  ['Bents 7-12, -3.5 m MLLW', { pileFrom: { bent: 7, row: null }, pileTo: { bent: 12, row: null }, depthBelowDatumM: 3.5, datum: 'MLLW' }],
  ['row D, bent 10, +0.5 m CD', { pileFrom: { bent: 10, row: 'D' }, depthBelowDatumM: -0.5, datum: 'CD' }],
  ['pile A-4, 3 m below chart datum', { pileFrom: { bent: 4, row: 'A' }, depthBelowDatumM: 3, datum: 'CD' }],
  ['One bracelet per pile at -3 m CD', { depthBelowDatumM: 3, datum: 'CD', note: 'One bracelet per pile' }],
  ['Transoms and keels, both hulls', { place: 'hull-bottom', note: 'Transoms, both hulls' }],
  ['see drawing 4410-220', { note: 'see drawing 4410-220' }],
];

/*
 * Texts the parser once misread (practitioner review): each with what it must say. A field the text gives twice
 * with different values is left unknown and the whole text is the note; a level or range it cannot be sure of
 * stays in the note. The asset kind is given where the review found hull words read on a structure or back.
 */
const MISREADS: [string, 'vessel' | 'structure' | undefined, Partial<AnodePosition>][] = [
  // Decimal commas; a level next to a pile is not the end of a pile range.
  ['1,2 m above keel', 'vessel', { heightAboveKeelM: 1.2, note: null }],
  ['Pile B7 -2,0 m LAT', 'structure', { pileFrom: { bent: 7, row: 'B' }, pileTo: null, depthBelowDatumM: 2, datum: 'LAT', note: null }],
  ['Pile B7 -2 m LAT', 'structure', { pileFrom: { bent: 7, row: 'B' }, pileTo: null, depthBelowDatumM: 2, datum: 'LAT', note: null }],
  ['Fr 22-30 P, 0,8 m above keel', 'vessel', { frameFrom: 22, frameTo: 30, side: 'port', heightAboveKeelM: 0.8, note: null }],
  // Two sides, places or frame ranges: never one picked by rule order.
  ['Fr 22 S; Fr 40 P', 'vessel', { frameFrom: null, frameTo: null, side: null, note: 'Fr 22 S; Fr 40 P' }],
  ['Fr 40 P, S', 'vessel', { frameFrom: 40, frameTo: 40, side: null, note: 'Fr 40 P, S' }],
  ['sea chest stbd fwd and port aft', 'vessel', { place: 'sea-chest', side: null, end: null, note: 'sea chest stbd fwd and port aft' }],
  ['Frames 118-124 port; sea chest starboard', 'vessel', { frameFrom: 118, frameTo: 124, place: 'sea-chest', side: null, note: 'Frames 118-124 port; sea chest starboard' }],
  ['Fr 22-30 P; 1.2 m above keel', 'vessel', { frameFrom: 22, frameTo: 30, side: 'port', heightAboveKeelM: 1.2, note: null }],
  // Datums: springs before plain low water; a bare level is ambiguous (depths below CD are written positive).
  ['2 m below low water springs', 'structure', { depthBelowDatumM: 2, datum: 'MLWS', note: null }],
  ['1.5 m below LWS', 'structure', { depthBelowDatumM: 1.5, datum: 'MLWS', note: null }],
  ['bent 2 row A, -1 m MLWS', 'structure', { pileFrom: { bent: 2, row: 'A' }, depthBelowDatumM: 1, datum: 'MLWS', note: null }],
  ['Fr 30-40 P, 1.2 m above keel; Fr 30-40 P, 1.4 m above keel', 'vessel', { frameFrom: 30, frameTo: 40, side: 'port', place: null, heightAboveKeelM: null, note: 'Fr 30-40 P, 1.2 m above keel; Fr 30-40 P, 1.4 m above keel' }],
  ['Pile B7, 2.0 m LAT', 'structure', { pileFrom: { bent: 7, row: 'B' }, depthBelowDatumM: null, datum: null, note: '2.0 m LAT' }],
  // Sides in lower case.
  ['fr 22 s', 'vessel', { frameFrom: 22, frameTo: 22, side: 'starboard', note: null }],
  ['FR 22-30 p', 'vessel', { frameFrom: 22, frameTo: 30, side: 'port', note: null }],
  // The asset kind: hull words mean nothing on a structure, pile words nothing on a vessel.
  ['Pile 22 S', 'structure', { side: null, note: 'Pile 22 S' }],
  ['S end of jetty', 'structure', { side: null, note: 'S end of jetty' }],
  ['Port Louis berth', 'structure', { side: null, note: 'Port Louis berth' }],
  ['Bents 3-4 port side', 'vessel', { pileFrom: null, side: 'port', note: 'Bents 3-4' }],
  // "aft of" says where the anodes are not; a frame range written with a slash.
  ['aft of Fr 40', 'vessel', { frameFrom: null, end: null, note: 'aft of Fr 40' }],
  ['Fr 118/124', 'vessel', { frameFrom: 118, frameTo: 124, note: null }],
  // Ranges of piles: read whole or left in the note, never reduced to one pile or row.
  ['B1-A to B6-D', 'structure', { pileFrom: { bent: 1, row: 'A' }, pileTo: { bent: 6, row: 'D' }, note: null }],
  ['B1-A/B6-D', 'structure', { pileFrom: { bent: 1, row: 'A' }, pileTo: { bent: 6, row: 'D' }, note: null }],
  ['Bent 1 row A to bent 6 row D', 'structure', { pileFrom: { bent: 1, row: 'A' }, pileTo: { bent: 6, row: 'D' }, note: null }],
  ['Piles A1-A12 and B1-B12', 'structure', { pileFrom: null, pileTo: null, note: 'Piles A1-A12 and B1-B12' }],
  // Depth ranges stay in the note.
  ['-2 to -6 m CD', 'structure', { depthBelowDatumM: null, datum: null, note: '-2 to -6 m CD' }],
  ['between -2 m and -6 m CD', 'structure', { depthBelowDatumM: null, datum: null, note: 'between -2 m and -6 m CD' }],
  ['Piles C1 to C12, 2 to 6 m below CD', 'structure', { pileFrom: { bent: 1, row: 'C' }, pileTo: { bent: 12, row: 'C' }, depthBelowDatumM: null, datum: null, note: '2 to 6 m below CD' }],
];

describe('parsePosition reads the texts it once misread', () => {
  it.each(MISREADS)('%s (%s)', (text, kind, expected) => {
    const parsed = parsePosition(text, kind);
    expect(parsed).toMatchObject(expected);
    // Nothing written is lost: every word is in a field or in the note.
    expect(anodePositionSchema.parse(parsed)).toEqual(parsed);
  });
});

describe('parsePosition reads position texts into data and keeps the rest as a note', () => {
  it.each(TABLE)('%s', (text, expected) => {
    const parsed = parsePosition(text);
    const want = { ...EMPTY_POSITION, ...expected };
    // The note is compared only where the row names one; elsewhere nothing of substance may be left over.
    if (!('note' in expected)) expect(parsed.note).toBeNull();
    expect({ ...parsed, note: 'note' in expected ? parsed.note : null }).toEqual({ ...want, note: 'note' in expected ? want.note : null });
    expect(anodePositionSchema.parse(parsed)).toEqual(parsed);
  });

  it('returns an empty position for a blank text', () => {
    expect(parsePosition('')).toEqual(EMPTY_POSITION);
    expect(parsePosition('   ')).toEqual(EMPTY_POSITION);
    expect(parsePosition(null)).toEqual(EMPTY_POSITION);
  });

  it('keeps a text it cannot read whole, as the note', () => {
    expect(parsePosition('wherever the diver finds room')).toEqual({ ...EMPTY_POSITION, note: 'wherever the diver finds room' });
  });

  it('does not read a frame number out of a drawing number or a side out of a word', () => {
    const p = parsePosition('Spare sheet 4410 Special');
    expect(p.frameFrom).toBeNull();
    expect(p.side).toBeNull();
    expect(p.note).toBe('Spare sheet 4410 Special');
  });
});

describe('formatPosition says a position in words', () => {
  it('says frames, side, height and part of a hull', () => {
    expect(formatPosition(parsePosition('frames 118 to 124 stbd, 1.2 m above keel'))).toBe('Frames 118–124, starboard, 1.2 m above keel');
    expect(formatPosition(parsePosition('Fr 40 P'))).toBe('Frame 40, port');
    expect(formatPosition(parsePosition('sea chest SB aft'))).toBe('Sea chest, aft, starboard');
  });
  it('says piles and the depth against its datum, and the note last', () => {
    expect(formatPosition(parsePosition('B1-A to B6-D, one per pile at -4 m CD'))).toBe('Piles bent 1 row A to bent 6 row D, 4 m below chart datum (CD); one per pile');
    expect(formatPosition(parsePosition('row D, bent 10, +0.5 m CD'))).toBe('Pile bent 10 row D, 0.5 m above chart datum (CD)');
  });
  it('gives null for an empty position', () => {
    expect(formatPosition(EMPTY_POSITION)).toBeNull();
  });
});

describe('parsePosition loses nothing', () => {
  it('keeps a second frame range, side or place in the note instead of dropping it', () => {
    expect(parsePosition('Fr 20-130 P/S, 4 of them within Fr 8-43')).toMatchObject({ frameFrom: 20, frameTo: 130, side: 'both', note: '4 of them within Fr 8-43' });
    // Two different sides, places or piles: the field is left unknown (never one picked by rule order) and the
    // note keeps the whole text as written.
    expect(parsePosition('Fr 10-20 P, then S')).toMatchObject({ frameFrom: 10, frameTo: 20, side: null, note: 'Fr 10-20 P, then S' });
    expect(parsePosition('rudder, sea chest')).toMatchObject({ place: null, note: 'rudder, sea chest' });
    expect(parsePosition('Pile B7 -2 m LAT, pile C3 -4 m LAT')).toMatchObject({ pileFrom: null, pileTo: null, depthBelowDatumM: null, datum: null, note: 'Pile B7 -2 m LAT, pile C3 -4 m LAT' });
  });
});
