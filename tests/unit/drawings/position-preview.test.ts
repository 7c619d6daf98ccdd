import { describe, expect, it } from 'vitest';
import { readAsWords } from '@/components/drawings/position-field';

describe('the live "Read as" preview under a position field', () => {
  it('says what the parser understood, for the asset kind', () => {
    expect(readAsWords('frames 118 to 124 stbd, 1.2 m above keel', 'vessel')).toBe('Read as: Frames 118–124, starboard, 1.2 m above keel');
    expect(readAsWords('Pile B7 -2,0 m LAT', 'structure')).toBe('Read as: Pile bent 7 row B, 2 m below lowest astronomical tide (LAT)');
    // On a structure a side is not read.
    expect(readAsWords('Port Louis berth', 'structure')).toBe('Read as: nothing placed on the drawing; kept as a note.');
    expect(readAsWords('   ', 'vessel')).toBeNull();
  });
});
