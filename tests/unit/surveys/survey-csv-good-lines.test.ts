import { describe, expect, it } from 'vitest';
import { parseSurveyCsv } from '@/lib/surveys';

const opts = { knownGroupLabels: ['Bent 1 piles'] };

describe('parseSurveyCsv: the potential hint speaks in the right unit', () => {
  it('does not suggest millivolts for -5.2 (a CP potential in millivolts is a number of hundreds)', () => {
    const result = parseSurveyCsv('location,potential_v,electrode\nA,-5.2,cse\n', opts);
    if (result.ok) throw new Error('expected an error');
    expect(result.errors[0].message).not.toContain('mV"');
    expect(result.errors[0].message).toBe('-5.2 is outside the plausible range -2.0 to +0.5 V. Potentials are in volts (-0.945) or in millivolts with the unit (-945 mV).');
  });

  it('still suggests millivolts for -945 and -1050', () => {
    for (const value of ['-945', '-1050']) {
      const result = parseSurveyCsv(`location,potential_v,electrode\nA,${value},cse\n`, opts);
      if (result.ok) throw new Error('expected an error');
      expect(result.errors[0].message).toContain(`If it is in millivolts, add the unit: "${value} mV".`);
    }
  });
});

describe('parseSurveyCsv: good lines of a file with errors', () => {
  it('lists the valid rows beside the errors', () => {
    const result = parseSurveyCsv('location,potential_v,electrode\nA,-0.95,cse\nB,abc,cse\nC,-0.96,cse\n', opts);
    if (result.ok) throw new Error('expected an error');
    expect(result.errors.map((e) => e.line)).toEqual([3]);
    expect(result.goodRows.map((r) => r.location)).toEqual(['A', 'C']);
  });

  it('offers no rows when the header is wrong or the file is over the row limit', () => {
    const header = parseSurveyCsv('place,potential_v\nA,-0.95\n', opts);
    if (header.ok) throw new Error('expected an error');
    expect(header.goodRows).toEqual([]);
    const long = parseSurveyCsv(['location,potential_v,electrode', 'A,-0.95,cse', 'B,-0.95,cse', 'C,-0.95,cse'].join('\n'), { ...opts, maxRows: 2 });
    if (long.ok) throw new Error('expected an error');
    expect(long.goodRows).toEqual([]);
  });
});
