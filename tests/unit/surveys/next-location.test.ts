import { describe, expect, it } from 'vitest';
import { nextLocation } from '@/lib/surveys/next-location';

// Invented locations as inspectors type them on a pontoon, in a dry dock or from a dive boat.
const CASES: [previous: string, beforePrevious: string | null, expected: string][] = [
  ['Fr 22 P', null, 'Fr 23 P'],
  ['Fr 22 P', 'Fr 20 P', 'Fr 24 P'],
  ['Fr 18 S', 'Fr 22 S', 'Fr 14 S'],
  ['Fr 22 P', 'Fr 20 S', 'Fr 23 P'],
  ['Pile B7', null, 'Pile B8'],
  ['Pile B7', 'Pile B6', 'Pile B8'],
  ['Pile B9', 'Pile B7', 'Pile B11'],
  ['P07', 'P06', 'P08'],
  ['P09', null, 'P10'],
  ['Bay 099', null, 'Bay 100'],
  ['KP 1.5', 'KP 1.0', 'KP 2.0'],
  ['KP 1.5', null, 'KP 1.6'],
  ['Stern tube', 'Rudder', 'Stern tube'],
  ['Sea chest 2 port', 'Sea chest 1 port', 'Sea chest 3 port'],
  ['Row 3 pile 12', 'Row 3 pile 11', 'Row 3 pile 13'],
  ['Row 4 pile 1', 'Row 3 pile 12', 'Row 4 pile 2'],
  ['Dolphin 1', 'Dolphin 3', 'Dolphin 1'],
  ['12', '10', '14'],
  ['Fr 22 P', 'Fr 22 P', 'Fr 23 P'],
  ['', null, ''],
  // A walk along a row of piles at one depth: the pile moves on, the depth stays.
  ['Pile B7 -2 m', 'Pile B6 -2 m', 'Pile B8 -2 m'],
  // Down one pile, depth by depth: the depth moves on by its step.
  ['Pile B7 -4 m', 'Pile B7 -2 m', 'Pile B7 -6 m'],
  // A frame range moving along: both ends move on.
  ['Fr 24-26 S', 'Fr 20-22 S', 'Fr 28-30 S'],
  ['Fr 24-26 S', 'Fr 20-23 S', 'Fr 24-27 S'],
  ['Fr 22 P 1.2 m', 'Fr 20 P 1.2 m', 'Fr 24 P 1.2 m'],
  ['Pile B7 -2 m', null, 'Pile B7 -3 m'],
];

describe('nextLocation', () => {
  it.each(CASES)('after %j (before it %j) proposes %j', (previous, beforePrevious, expected) => {
    expect(nextLocation(previous, beforePrevious)).toBe(expected);
  });
});
