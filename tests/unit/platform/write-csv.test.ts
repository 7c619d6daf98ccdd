import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { csvField, writeCsv, type CsvCell } from '@/lib/csv/write-csv';

const parse = (csv: string) => Papa.parse<string[]>(csv, { delimiter: ',', newline: '\r\n', skipEmptyLines: false }).data;

describe('writeCsv: RFC 4180 layout', () => {
  it('joins fields with commas and ends every line, the last one too, with CRLF', () => {
    expect(writeCsv([['a', 'b'], ['c', 'd']])).toBe('a,b\r\nc,d\r\n');
  });

  it('writes an empty row as a blank line and rows of different lengths as they are', () => {
    expect(writeCsv([['a', 'b'], [], ['c']])).toBe('a,b\r\n\r\nc\r\n');
  });

  it('writes nothing for no rows, and an empty cell for null and undefined', () => {
    expect(writeCsv([])).toBe('');
    expect(writeCsv([[null, 'x', undefined]])).toBe(',x,\r\n');
  });

  it('writes no byte order mark', () => {
    expect(writeCsv([['zone']]).charCodeAt(0)).toBe('z'.charCodeAt(0));
  });
});

describe('writeCsv: quoting', () => {
  it.each<[string, string, string]>([
    ['quotes a field holding a comma', 'Fr 40, port', '"Fr 40, port"'],
    ['quotes a field holding a quote and doubles the quote', 'say "hi"', '"say ""hi"""'],
    ['quotes a field holding a line feed', 'first\nsecond', '"first\nsecond"'],
    ['quotes a field holding a CRLF line break', 'first\r\nsecond', '"first\r\nsecond"'],
    ['quotes a field holding a semicolon, the list separator of some spreadsheet locales', 'P; S', '"P; S"'],
    ['leaves a plain field unquoted', 'TW-AW-4020', 'TW-AW-4020'],
  ])('%s', (_behaviour, input, expected) => {
    expect(csvField(input)).toBe(expected);
  });

  it('reads back unchanged with a CSV parser', () => {
    const cells = ['Fr 40 "A", P; 2 rows\nsecond line', 'plain', 'a,b'];
    expect(parse(writeCsv([cells]))[0]).toEqual(cells);
  });
});

// Formula injection: common practice (OWASP CSV injection guidance). A spreadsheet runs a cell
// starting with =, +, -, @, a tab or a carriage return as a formula; such texts get an apostrophe,
// while plain numbers stay numbers.
describe('writeCsv: formula injection (common practice, OWASP CSV injection guidance)', () => {
  it.each<[string, CsvCell, string]>([
    ['prefixes =SUM(A1) with an apostrophe', '=SUM(A1)', "'=SUM(A1)"],
    ['prefixes +1 when more follows it (+1+1)', '+1+1', "'+1+1"],
    ['prefixes +1 followed by text', '+1 call me', "'+1 call me"],
    ['prefixes @cmd with an apostrophe', '@cmd', "'@cmd"],
    ["prefixes -2+3+cmd|' /C calc'!A0 although it starts like a number", "-2+3+cmd|' /C calc'!A0", "'-2+3+cmd|' /C calc'!A0"],
    ['prefixes a tab-leading field', '\tcmd', "'\tcmd"],
    ['prefixes a carriage-return-leading field and quotes it for the line break', '\r=cmd', `"'\r=cmd"`],
    ['prefixes a lone minus sign, which is not a number', '-', "'-"],
    ['prefixes a lone at sign', '@', "'@"],
    ['prefixes a line-feed-leading field and quotes it for the line break', '\n=cmd', `"'\n=cmd"`],
    ['prefixes a full-width equals sign', '\uFF1DSUM(A1)', "'\uFF1DSUM(A1)"],
    ['prefixes a full-width plus, minus and at sign', '\uFF0B1\uFF0B1', "'\uFF0B1\uFF0B1"],
    ['prefixes a full-width minus', '\uFF0D2+3', "'\uFF0D2+3"],
    ['prefixes a full-width at sign', '\uFF20cmd', "'\uFF20cmd"],
    ['leaves the number -0.85 as -0.85', -0.85, '-0.85'],
    ['leaves the numeric text "-0.85" as a number', '-0.85', '-0.85'],
    ['leaves the numeric text "-1.05" as a number', '-1.05', '-1.05'],
    ['leaves the numeric text "+1", just a signed number, as a number', '+1', '+1'],
    ['leaves the numeric text "+1.5e3" as a number', '+1.5e3', '+1.5e3'],
    ['leaves a text with a minus further in alone', 'Fr 40-52 P', 'Fr 40-52 P'],
    ['leaves a text with an equals sign further in alone', 'a=b', 'a=b'],
  ])('%s', (_behaviour, input, expected) => {
    expect(csvField(input)).toBe(expected);
  });

  it('writes the numbers -0.85 and -1.05 in a row unescaped', () => {
    expect(writeCsv([[-0.85, -1.05]])).toBe('-0.85,-1.05\r\n');
  });

  it('prefixes and quotes a formula that also holds a comma, and it reads back with the apostrophe', () => {
    const csv = writeCsv([['=HYPERLINK("http://example.invalid","click")']]);
    expect(csv).toBe(`"'=HYPERLINK(""http://example.invalid"",""click"")"\r\n`);
    expect(parse(csv)[0][0]).toBe('\'=HYPERLINK("http://example.invalid","click")');
  });
});
