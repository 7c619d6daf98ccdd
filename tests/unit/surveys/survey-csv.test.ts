import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import {
  MAX_REPORTED_ERRORS,
  SURVEY_CSV_COLUMNS,
  SURVEY_CSV_COLUMN_NAMES,
  SURVEY_CSV_TEMPLATE,
  SURVEY_CSV_TEMPLATE_GROUP_LABELS,
  electrodeFromName,
  parseSurveyCsv,
  type ParseSurveyCsvOptions,
  type ParseSurveyCsvResult,
  type ParsedReading,
  type SurveyCsvError,
} from '@/lib/surveys';

const GROUPS = ['Bent 1 piles', 'Bent 2 piles', 'Stern', 'Rudder', 'Sea chest', 'Bow thruster', 'Quay wall'];
const opts = (o: Partial<ParseSurveyCsvOptions> = {}): ParseSurveyCsvOptions => ({ knownGroupLabels: GROUPS, ...o });

function rowsOf(r: ParseSurveyCsvResult): ParsedReading[] {
  if (!r.ok) throw new Error(`expected ok, got ${JSON.stringify(r.errors)}`);
  return r.rows;
}
function errorsOf(r: ParseSurveyCsvResult): SurveyCsvError[] {
  if (r.ok) throw new Error(`expected errors, got ${r.rows.length} rows`);
  return r.errors;
}

describe('parseSurveyCsv: valid files', () => {
  it('reads a comma file with quoted commas, any column order and case, aliases and percent', () => {
    const csv = [
      'Comment,LOCATION,Potential_V,electrode,remaining,anode_group',
      '"Anode intact, light growth",B3-A,-0.945,Ag/AgCl,65%,Bent 1 piles',
      ',CH 120.5,-945 mV,silver chloride,65 %,',
      'after cleaning,Fr 42 P,-0.98,Cu/CuSO4,0.4,stern', // group matched without case, recorded spelling kept
      ',B3-B,,,0.25,Bent 2 piles',
      ',B3-C,-0.78,calomel,,',
      ',B3-D,0.25,Zn,,',
    ].join('\n');
    const rows = rowsOf(parseSurveyCsv(csv, opts()));
    expect(rows.map((r) => r.line)).toEqual([2, 3, 4, 5, 6, 7]);
    expect(rows[0]).toEqual({
      line: 2,
      location: 'B3-A',
      potentialV: -0.945,
      electrode: 'ag-agcl-seawater',
      potentialAgAgClV: -0.945,
      anodeGroupLabel: 'Bent 1 piles',
      remainingFraction: 0.65,
      comment: 'Anode intact, light growth',
    });
    expect(rows[1]).toMatchObject({ location: 'CH 120.5', potentialV: -0.945, electrode: 'ag-agcl-seawater', remainingFraction: 0.65, anodeGroupLabel: null, comment: null });
    expect(rows[2]).toMatchObject({ electrode: 'cse', anodeGroupLabel: 'Stern', remainingFraction: 0.4 });
    expect(rows[3]).toMatchObject({ potentialV: null, electrode: null, potentialAgAgClV: null, remainingFraction: 0.25 });
    expect(rows[4].electrode).toBe('sce');
    expect(rows[5].electrode).toBe('zinc');
  });

  it('reads a semicolon file with decimal commas', () => {
    const csv = ['location;potential_v;electrode;remaining;comment', 'B1-A;-0,945;ag-agcl-seawater;0,65;"Anode sound; growth, light"', 'B1-B;-950,5 mV;cse;62,5 %;'].join('\r\n');
    const rows = rowsOf(parseSurveyCsv(csv, opts()));
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatchObject({ potentialV: -0.945, remainingFraction: 0.65, comment: 'Anode sound; growth, light' });
    expect(rows[1]).toMatchObject({ potentialV: -0.9505, electrode: 'cse', remainingFraction: 0.625 });
  });

  it('refuses decimal commas in a comma file', () => {
    const errors = errorsOf(parseSurveyCsv('location,potential_v,electrode\nB1-A,"-0,945",cse\n', opts()));
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatchObject({ line: 2, column: 'potential_v' });
    expect(errors[0].message).toMatch(/decimal separator/);
    // unquoted, the decimal comma splits the value: the row has too many values
    const split = errorsOf(parseSurveyCsv('location,potential_v,electrode\nB1-A,-0,945,cse\n', opts()));
    expect(split[0].line).toBe(2);
    expect(split[0].message).toMatch(/4 values but the header has 3 columns/);
  });

  it('honours an Excel "sep=;" line', () => {
    const rows = rowsOf(parseSurveyCsv('sep=;\nlocation;potential_v;electrode\nB1-A;-0,9;cse\n', opts()));
    expect(rows).toEqual([expect.objectContaining({ line: 2, potentialV: -0.9, electrode: 'cse' })]);
  });

  it('uses the default electrode where the column is blank, and strips a BOM', () => {
    const rows = rowsOf(parseSurveyCsv('\uFEFFlocation,potential_v,electrode\nB1-A,-0.85,\nB1-B,-0.85,ag-agcl-seawater\n', opts({ defaultElectrode: 'cse' })));
    expect(rows.map((r) => r.electrode)).toEqual(['cse', 'ag-agcl-seawater']);
  });

  it('converts to Ag/AgCl/seawater with the trade equivalence', () => {
    // common practice (design-basis.md, Reference electrodes): -0.80 V Ag/AgCl/seawater = about -0.85 V CSE
    // = about -0.78 V SCE = about +0.25 V vs zinc; checked within 0.02 V
    const csv = ['location,potential_v,electrode', 'P1,-0.85,CSE', 'P2,-0.78,SCE', 'P3,0.25,zinc', 'P4,-0.80,AgAgCl'].join('\n');
    const rows = rowsOf(parseSurveyCsv(csv, opts()));
    for (const r of rows) expect(Math.abs((r.potentialAgAgClV ?? NaN) - -0.8)).toBeLessThanOrEqual(0.02);
    // common practice: 50 mV between CSE and Ag/AgCl/seawater in European practice (lib/cp pins it)
    expect(rows[0].potentialAgAgClV).toBe(-0.8);
    expect(rows[0].potentialV).toBe(-0.85); // the reading as measured is kept
  });

  it('skips blank lines and all-blank rows', () => {
    const rows = rowsOf(parseSurveyCsv('\nlocation,remaining\n\n,\nB1-A,0.5\n   \nB1-B,0.6\n\n', opts()));
    expect(rows.map((r) => [r.location, r.line])).toEqual([
      ['B1-A', 5],
      ['B1-B', 7],
    ]);
  });

  it('parses the template cleanly', () => {
    const rows = rowsOf(parseSurveyCsv(SURVEY_CSV_TEMPLATE, opts({ knownGroupLabels: [...SURVEY_CSV_TEMPLATE_GROUP_LABELS] })));
    expect(rows.map((r) => r.location)).toEqual(['B1-A', 'B1-B', 'Fr 42 P']);
    expect(rows.some((r) => r.electrode === 'cse')).toBe(true);
    expect(rows.some((r) => r.comment?.includes(','))).toBe(true); // shows quoting
  });

  it('documents every column exactly once, location alone required', () => {
    expect(SURVEY_CSV_COLUMNS.map((c) => c.name)).toEqual([...SURVEY_CSV_COLUMN_NAMES]);
    expect(SURVEY_CSV_COLUMNS.filter((c) => c.required).map((c) => c.name)).toEqual(['location']);
    // the documented examples form a valid row (quoted by papaparse where needed)
    const csv = Papa.unparse([SURVEY_CSV_COLUMNS.map((c) => c.name), SURVEY_CSV_COLUMNS.map((c) => c.example)]);
    const [row] = rowsOf(parseSurveyCsv(csv, opts()));
    expect(row).toMatchObject({ location: 'B3-A', potentialV: -0.945, electrode: 'ag-agcl-seawater', remainingFraction: 0.65 });
  });
});

describe('parseSurveyCsv: errors', () => {
  it('refuses unknown columns, naming them', () => {
    const errors = errorsOf(parseSurveyCsv('location,potential_v,Diver,depth_m\nB1,-0.9\n', opts({ defaultElectrode: 'cse' })));
    expect(errors).toHaveLength(1);
    expect(errors[0].line).toBe(1);
    expect(errors[0].message).toContain('"Diver"');
    expect(errors[0].message).toContain('"depth_m"');
  });

  it('refuses a header without location, or without potential_v and remaining', () => {
    expect(errorsOf(parseSurveyCsv('potential_v,electrode\n-0.9,cse\n', opts()))).toEqual([expect.objectContaining({ line: 1, column: 'location' })]);
    expect(errorsOf(parseSurveyCsv('location,comment\nB1,x\n', opts()))[0].message).toMatch(/potential_v.*remaining/);
    expect(errorsOf(parseSurveyCsv('location,remaining,Remaining\nB1,0.5,0.5\n', opts()))[0].message).toMatch(/more than once/);
  });

  it('refuses an empty file and a header without readings', () => {
    expect(errorsOf(parseSurveyCsv('\n\n', opts()))[0].message).toMatch(/no header/);
    expect(errorsOf(parseSurveyCsv('location,remaining\n\n', opts()))[0].message).toMatch(/no readings/);
  });

  it('reports every bad row with its spreadsheet line, after blank lines and a multi-line comment', () => {
    const csv = [
      'location,potential_v,electrode,anode_group,remaining,comment', // 1
      'B1-A,-0.95,cse,,,', // 2 ok
      '', // 3 blank
      ',-0.95,cse,,,', // 4 missing location
      'B1-C,,,,,only a comment', // 5 neither potential nor remaining
      'B1-D,-0.9,cse,,,"first line', // 6 starts a two-line comment
      'second line, with a comma"',
      'B1-E,-0.9,cse,Pier 9,,', // 7 in a spreadsheet (8th text line): unknown group
      '', // 8 blank
      'B1-F,-3.1,cse,,150%,', // 9: two errors
    ].join('\n');
    const errors = errorsOf(parseSurveyCsv(csv, opts()));
    expect(errors.map((e) => [e.line, e.column ?? null])).toEqual([
      [4, 'location'],
      [5, null],
      [7, 'anode_group'],
      [9, 'potential_v'],
      [9, 'remaining'],
    ]);
    expect(errors[2].textLine).toBe(8);
    expect(errors[4].textLine).toBe(10);
    expect(errors[0].textLine).toBeUndefined(); // same line in a text editor
    expect(errors[1].message).toMatch(/potential_v or a remaining/);
  });

  it('keeps the multi-line comment of a good row', () => {
    const rows = rowsOf(parseSurveyCsv('location,remaining,comment\r\nB1,0.5,"line one\r\nline two"\r\nB2,0.6,\r\n', opts()));
    expect(rows[0].comment).toBe('line one\nline two');
    expect(rows[1].line).toBe(3);
  });

  it('lists up to 5 known labels for an unknown group', () => {
    const [e] = errorsOf(parseSurveyCsv('location,remaining,anode_group\nB1,0.5,Pier 9\n', opts()));
    expect(e.message).toContain('"Pier 9"');
    for (const l of GROUPS.slice(0, 5)) expect(e.message).toContain(`"${l}"`);
    expect(e.message).not.toContain('"Bow thruster"');
    expect(e.message).toContain('2 more');
    const [none] = errorsOf(parseSurveyCsv('location,remaining,anode_group\nB1,0.5,Pier 9\n', opts({ knownGroupLabels: [] })));
    expect(none.message).toMatch(/no anode groups/);
  });

  it('checks the range of potentials, including at the bounds', () => {
    const csv = ['location,potential_v,electrode', 'a,-2.0,cse', 'b,0.5,cse', 'c,-2.001,cse', 'd,0.501,cse', 'e,-945,cse', 'f,-2001 mV,cse', 'g,abc,cse', 'h,-0.9 volts,cse'].join('\n');
    const errors = errorsOf(parseSurveyCsv(csv, opts()));
    expect(errors.map((e) => e.line)).toEqual([4, 5, 6, 7, 8, 9]);
    expect(errors.every((e) => e.column === 'potential_v')).toBe(true);
    expect(errors[2].message).toContain('-945 mV'); // hint: millivolts need the unit
  });

  it('checks remaining values: fraction 0..1 or percent 0..100', () => {
    const csv = ['location,remaining', 'a,0', 'b,1', 'c,100%', 'd,1.01', 'e,65', 'f,-0.1', 'g,101 %', 'h,lots'].join('\n');
    const errors = errorsOf(parseSurveyCsv(csv, opts()));
    expect(errors.map((e) => e.line)).toEqual([5, 6, 7, 8, 9]);
    expect(errors[1].message).toContain('65%'); // hint: add the percent sign
  });

  it('refuses an unknown electrode, and a potential without electrode or default', () => {
    const csv = ['location,potential_v,electrode', 'a,-0.9,Ag/AgCl sat. KCl', 'b,-0.9,', 'c,,cse'].join('\n');
    const errors = errorsOf(parseSurveyCsv(csv + '\nd,,', opts()));
    expect(errors.map((e) => [e.line, e.column ?? null])).toEqual([
      [2, 'electrode'],
      [3, 'electrode'],
      [4, null], // electrode alone is not a reading
      [5, null],
    ]);
  });

  it('limits location and comment length', () => {
    const csv = `location,remaining,comment\n${'L'.repeat(80)},0.5,${'c'.repeat(500)}\n${'L'.repeat(81)},0.5,\nok,0.5,${'c'.repeat(501)}\n`;
    const errors = errorsOf(parseSurveyCsv(csv, opts()));
    expect(errors.map((e) => [e.line, e.column])).toEqual([
      [3, 'location'],
      [4, 'comment'],
    ]);
  });

  it('reports a value under a blank header column, but accepts trailing empty columns', () => {
    rowsOf(parseSurveyCsv('location,remaining,,\nB1,0.5,,\n', opts()));
    expect(errorsOf(parseSurveyCsv('location,remaining,,\nB1,0.5,,x\n', opts()))[0].line).toBe(2);
  });

  it('reports an unclosed quote at the row where it starts', () => {
    const errors = errorsOf(parseSurveyCsv('location,remaining,comment\nB1,0.5,ok\nB2,0.5,"never closed\nB3,0.5,x\n', opts()));
    expect(errors).toHaveLength(1);
    expect(errors[0].line).toBe(3);
    expect(errors[0].message).toMatch(/never closed/);
  });

  it('caps the list at 200 errors with a final count of the rest', () => {
    const csv = ['location,remaining', ...Array.from({ length: 250 }, () => ',0.5')].join('\n');
    const errors = errorsOf(parseSurveyCsv(csv, opts()));
    expect(errors).toHaveLength(MAX_REPORTED_ERRORS + 1);
    expect(errors[MAX_REPORTED_ERRORS - 1].line).toBe(201);
    expect(errors[MAX_REPORTED_ERRORS]).toMatchObject({ line: 202 });
    expect(errors[MAX_REPORTED_ERRORS].message).toMatch(/and 50 more errors/);
  });

  it('refuses more rows than maxRows', () => {
    const csv = (n: number) => ['location,remaining', ...Array.from({ length: n }, (_, i) => `P${i},0.5`)].join('\n');
    expect(rowsOf(parseSurveyCsv(csv(3), opts({ maxRows: 3 })))).toHaveLength(3);
    const errors = errorsOf(parseSurveyCsv(csv(4), opts({ maxRows: 3 })));
    expect(errors).toEqual([expect.objectContaining({ line: 5 })]);
    expect(errors[0].message).toMatch(/more than 3 readings/);
  });
});

describe('electrodeFromName', () => {
  it('maps the friendly names', () => {
    const cases: [string, string | null][] = [
      ['ag-agcl-seawater', 'ag-agcl-seawater'],
      ['Ag/AgCl', 'ag-agcl-seawater'],
      ['AgAgCl', 'ag-agcl-seawater'],
      ['Silver Chloride', 'ag-agcl-seawater'],
      ['Cu/CuSO4', 'cse'],
      ['CSE', 'cse'],
      ['copper sulphate', 'cse'],
      ['copper sulfate', 'cse'],
      ['SCE', 'sce'],
      ['calomel', 'sce'],
      ['Zn', 'zinc'],
      ['zinc', 'zinc'],
      ['she', null], // not a field electrode
      ['Ag/AgCl KCl', null],
    ];
    for (const [name, expected] of cases) expect(electrodeFromName(name), name).toBe(expected);
  });
});
