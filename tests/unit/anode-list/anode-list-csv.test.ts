import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { ANODE_LIST_CSV_HEADER, ANODE_LIST_CSV_ORDER_HEADER, anodeListCsv, buildAnodeList, csvField } from '@/lib/anode-list';
import { smallInput, smallRenewals } from './helpers';

const parse = (csv: string) => Papa.parse<string[]>(csv, { delimiter: ',', newline: '\r\n', skipEmptyLines: false }).data;

describe('anodeListCsv: structure', () => {
  const csv = anodeListCsv(buildAnodeList(smallInput()));
  const lines = csv.split('\r\n');

  it('uses CRLF line ends and ends with one', () => {
    expect(csv.endsWith('\r\n')).toBe(true);
    expect(csv.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
  });

  it('has a header, one row per line zone by zone, a blank line, the ordering totals and a totals row', () => {
    expect(lines[0]).toBe(ANODE_LIST_CSV_HEADER.join(','));
    // Zones in input order, lines by group label: Bottom P2, Bottom P10, Bottom S2, Rudder, Sea chest grid.
    expect(lines.slice(1, 6).map((l) => l.split(',')[1])).toEqual(['Bottom P2', 'Bottom P10', 'Bottom S2', 'Rudder', 'Sea chest grid']);
    expect(lines[6]).toBe('');
    expect(lines[7]).toBe('ordering totals');
    expect(lines[8]).toBe(ANODE_LIST_CSV_ORDER_HEADER.join(','));
    expect(lines.slice(9, 12)).toEqual([
      'TW-AW-4020,al-zn-in,flush-weld,22,7.7,8.7,169.4,191.4',
      'TW-AW-6512,al-zn-in,flush-weld,8,9.8,11,78.4,88',
      'TW-ZB-2510,zinc,flush-bolt,10,4.7,5,47,50',
    ]);
    expect(lines[12]).toBe('total,,,40,,,294.8,329.4');
    expect(lines[13]).toBe(''); // after the final CRLF
    expect(lines).toHaveLength(14);
  });

  it('writes each line with quantity, masses each and in total, positions, reason, status and renew-by date', () => {
    expect(lines[2]).toBe('Hull bottom,Bottom P10,TW-AW-4020,al-zn-in,flush-weld,12,7.7,8.7,92.4,104.4,"Fr 40-52 P, 1.0 m above keel",forecast depletion,confirmed,');
    // A line without a zone has an empty zone cell and an empty positions cell; without a renew-by date, an empty last cell.
    expect(lines[5]).toBe(',Sea chest grid,TW-ZB-2510,zinc,flush-bolt,6,4.7,5,28.2,30,,damage,proposed,');
  });

  it('reads back as a table of 14 columns with a spreadsheet parser', () => {
    const rows = parse(csv);
    expect(rows[0]).toHaveLength(14);
    expect(rows.slice(1, 6).every((r) => r.length === 14)).toBe(true);
    expect(rows[2][10]).toBe('Fr 40-52 P, 1.0 m above keel');
  });

  it("writes a line's renew-by date as YYYY-MM-DD under renew_by", () => {
    const renewals = smallRenewals();
    renewals[0] = { ...renewals[0], renewBy: '2027-11-09' };
    const rows = parse(anodeListCsv(buildAnodeList({ ...smallInput(), renewals })));
    expect(rows[0][13]).toBe('renew_by');
    expect(rows.find((r) => r[1] === 'Bottom P10')![13]).toBe('2027-11-09');
    expect(rows.find((r) => r[1] === 'Bottom P2')![13]).toBe('');
  });
});

describe('anodeListCsv: quoting and formula neutralisation', () => {
  const renewals = smallRenewals();
  renewals[0] = { ...renewals[0], groupLabel: '=HYPERLINK("http://example.invalid","click")', positions: 'Fr 40 "A", P; 2 rows\nsecond line' };
  renewals[1] = { ...renewals[1], groupLabel: '+cmd', positions: '-2+3+cmd|\' /C calc\'!A0' };
  renewals[2] = { ...renewals[2], groupLabel: '@SUM(A1:A9)', positions: '-12.5' };
  const csv = anodeListCsv(buildAnodeList({ ...smallInput(), renewals }));
  const rows = parse(csv);
  const byGroup = (label: string) => rows.find((r) => r[1] === label);

  it('quotes fields with quotes, commas, semicolons and line breaks, and they read back unchanged', () => {
    const row = byGroup('\'=HYPERLINK("http://example.invalid","click")');
    expect(row).toBeDefined();
    expect(row![10]).toBe('Fr 40 "A", P; 2 rows\nsecond line');
  });

  it('prefixes texts that a spreadsheet would run as a formula with an apostrophe', () => {
    expect(byGroup("'+cmd")![10]).toBe("'-2+3+cmd|' /C calc'!A0");
    expect(byGroup("'@SUM(A1:A9)")).toBeDefined();
    expect(csv).not.toMatch(/(^|,)"?=HYPERLINK/m);
  });

  it('leaves numbers alone, even negative ones', () => {
    expect(byGroup("'@SUM(A1:A9)")![10]).toBe('-12.5');
  });

  it.each([
    ['=1+2', "'=1+2"],
    ['+44 20 7946 0000', "'+44 20 7946 0000"],
    ['-', "'-"],
    ['-3', '-3'],
    ['+1.5e3', '+1.5e3'],
    ['@', "'@"],
    ['\tcmd', "'\tcmd"],
    ['\r=cmd', `"'\r=cmd"`],
    ['plain', 'plain'],
    ['a,b', '"a,b"'],
    ['say "hi"', '"say ""hi"""'],
    ['=A1;B1', `"'=A1;B1"`],
    [null, ''],
    [42, '42'],
  ])('csvField(%j) is %j', (input, expected) => {
    expect(csvField(input as string | number | null)).toBe(expected);
  });
});
