import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { ANODE_LIST_CSV_HEADER, ANODE_LIST_LINE_COLUMNS, anodeListCsv, buildAnodeList, csvField } from '@/lib/anode-list';
import { smallInput, smallRenewals } from './helpers';

const parse = (csv: string) => Papa.parse<string[]>(csv, { delimiter: ',', newline: '\r\n', skipEmptyLines: false }).data;

describe('anodeListCsv: structure', () => {
  const input = smallInput();
  input.renewals[0] = { ...input.renewals[0], dimensions: { lengthM: 0.4, widthM: 0.2, thicknessM: 0.06 } };
  const csv = anodeListCsv(buildAnodeList(input));
  const lines = csv.split('\r\n');

  it('uses CRLF line ends and ends with one', () => {
    expect(csv.endsWith('\r\n')).toBe(true);
    expect(csv.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
  });

  it("is one table: the zone, then the PDF's line columns in the PDF's words, one row per line, nothing appended", () => {
    expect(ANODE_LIST_CSV_HEADER).toEqual(['Zone', ...ANODE_LIST_LINE_COLUMNS]);
    expect(lines[0]).toBe('Zone,Group,Model,"Dimensions, mm",Alloy,Mounting,Qty,"Net each, kg","Gross each, kg","Net total, kg","Gross total, kg",Positions,Renew by,Status');
    // Zones in input order, lines by group label: Bottom P2, Bottom P10, Bottom S2, Rudder, Sea chest grid.
    expect(lines.slice(1, 6).map((l) => l.split(',')[1])).toEqual(['Bottom P2', 'Bottom P10', 'Bottom S2', 'Rudder', 'Sea chest grid']);
    expect(lines[6]).toBe(''); // after the final CRLF
    expect(lines).toHaveLength(7);
  });

  it('writes labels, never stored codes: alloy, mounting, status and "No zone"', () => {
    expect(lines[2]).toBe('Hull bottom,Bottom P10,TW-AW-4020,400 × 200 × 60,Al-Zn-In,"Flush, weld-on",12,7.7,8.7,92.4,104.4,"Fr 40-52 P, 1.0 m above keel",,Confirmed');
    expect(lines[5]).toBe('No zone,Sea chest grid,TW-ZB-2510,,Zinc,"Flush, bolt-on",6,4.7,5,28.2,30,,,Proposed');
    expect(csv).not.toMatch(/al-zn-in|flush-weld|flush-bolt|,confirmed|,proposed/);
  });

  it('reads back as a table of 14 columns with a spreadsheet parser', () => {
    const rows = parse(csv).filter((r) => r.length > 1);
    expect(rows).toHaveLength(6);
    expect(rows.every((r) => r.length === 14)).toBe(true);
    expect(rows[2][11]).toBe('Fr 40-52 P, 1.0 m above keel');
  });

  it("writes a line's renew-by date as YYYY-MM-DD under Renew by", () => {
    const renewals = smallRenewals();
    renewals[0] = { ...renewals[0], renewBy: '2027-11-09' };
    const rows = parse(anodeListCsv(buildAnodeList({ ...smallInput(), renewals })));
    expect(rows[0][12]).toBe('Renew by');
    expect(rows.find((r) => r[1] === 'Bottom P10')![12]).toBe('2027-11-09');
    expect(rows.find((r) => r[1] === 'Bottom P2')![12]).toBe('');
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
    expect(row![11]).toBe('Fr 40 "A", P; 2 rows\nsecond line');
  });

  it('prefixes texts that a spreadsheet would run as a formula with an apostrophe', () => {
    expect(byGroup("'+cmd")![11]).toBe("'-2+3+cmd|' /C calc'!A0");
    expect(byGroup("'@SUM(A1:A9)")).toBeDefined();
    expect(csv).not.toMatch(/(^|,)"?=HYPERLINK/m);
  });

  it('leaves numbers alone, even negative ones', () => {
    expect(byGroup("'@SUM(A1:A9)")![11]).toBe('-12.5');
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
