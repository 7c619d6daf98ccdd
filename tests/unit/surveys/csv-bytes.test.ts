import { describe, expect, it } from 'vitest';
import { checkCsvBytes } from '@/lib/surveys';

const MB = 1024 * 1024;
const enc = (s: string): Uint8Array => new TextEncoder().encode(s);
const concat = (...parts: (Uint8Array | number[])[]): Uint8Array => {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let i = 0;
  for (const p of parts) {
    out.set(p, i);
    i += p.length;
  }
  return out;
};

describe('checkCsvBytes', () => {
  it('refuses a 20 MB file with a 5 MB limit, naming the limit', () => {
    const r = checkCsvBytes(new Uint8Array(20 * MB).fill(0x41), { maxBytes: 5 * MB });
    expect(r).toMatchObject({ ok: false, code: 'too-large' });
    if (!r.ok) expect(r.message).toContain('5 MB');
  });

  it('accepts a file exactly at the limit', () => {
    const bytes = enc('location,remaining\nB1,0.5\n');
    expect(checkCsvBytes(bytes, { maxBytes: bytes.length }).ok).toBe(true);
    expect(checkCsvBytes(bytes, { maxBytes: bytes.length - 1 })).toMatchObject({ ok: false, code: 'too-large' });
  });

  it('refuses a PNG named .csv as binary', () => {
    const png = concat([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a], [0, 0, 0, 0x0d], enc('IHDR'));
    expect(checkCsvBytes(png, { maxBytes: MB })).toMatchObject({ ok: false, code: 'binary' });
  });

  it('recognises PDF, JPEG and spreadsheet workbooks, naming no spreadsheet program', () => {
    expect(checkCsvBytes(enc('%PDF-1.7\n...'), { maxBytes: MB })).toMatchObject({ ok: false, code: 'binary' });
    expect(checkCsvBytes(new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 1, 2]), { maxBytes: MB })).toMatchObject({ ok: false, code: 'binary' });
    const xlsx = concat([0x50, 0x4b, 0x03, 0x04], new Uint8Array(26), enc('[Content_Types].xml'), enc('xl/workbook.xml'));
    const r = checkCsvBytes(xlsx, { maxBytes: MB });
    expect(r).toMatchObject({ ok: false, code: 'binary' });
    if (!r.ok) expect(r.message).toBe('This looks like a spreadsheet workbook; save it from the spreadsheet as CSV (comma separated) first.');
    const zip = concat([0x50, 0x4b, 0x03, 0x04], new Uint8Array(26), enc('readings.csv'));
    const z = checkCsvBytes(zip, { maxBytes: MB });
    expect(z).toMatchObject({ ok: false, code: 'binary' });
    if (!z.ok) expect(z.message).toMatch(/ZIP/);
  });

  it('refuses text with NUL bytes as binary', () => {
    expect(checkCsvBytes(concat(enc('location'), [0], enc(',x')), { maxBytes: MB })).toMatchObject({ ok: false, code: 'binary' });
  });

  it('refuses invalid UTF-8 (a Windows-1252 degree sign) and UTF-16', () => {
    const latin1 = concat(enc('location,comment\nB1,12'), [0xb0], enc('C\n'));
    expect(checkCsvBytes(latin1, { maxBytes: MB })).toMatchObject({ ok: false, code: 'encoding' });
    const utf16 = concat([0xff, 0xfe], [0x6c, 0, 0x6f, 0]);
    expect(checkCsvBytes(utf16, { maxBytes: MB })).toMatchObject({ ok: false, code: 'encoding' });
  });

  it('strips a UTF-8 BOM and keeps non-ASCII text', () => {
    const r = checkCsvBytes(concat([0xef, 0xbb, 0xbf], enc('location,comment\nB1,12 °C\n')), { maxBytes: MB });
    expect(r).toEqual({ ok: true, text: 'location,comment\nB1,12 °C\n' });
  });

  it('refuses empty files, a lone BOM and whitespace', () => {
    for (const b of [new Uint8Array(0), new Uint8Array([0xef, 0xbb, 0xbf]), enc(' \r\n\n')]) {
      expect(checkCsvBytes(b, { maxBytes: MB })).toMatchObject({ ok: false, code: 'empty' });
    }
  });
});
