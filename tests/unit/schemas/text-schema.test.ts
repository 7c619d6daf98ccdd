// The one string schema (lib/schemas/text): what it refuses, and that no other string schema is left.
import { readFile, readdir } from 'node:fs/promises';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { BROKEN_CHARACTER_MESSAGE, CONTROL_CHARACTER_MESSAGE, LINE_BREAK_MESSAGE, multilineText, text, textProblem } from '@/lib/schemas/text';

const ROOT = path.resolve(import.meta.dirname, '../../..');

describe('text()', () => {
  const name = text({ error: 'Name it.' }).trim().min(1, 'Name it.').max(20, 'Too long.');
  const messages = (value: unknown) => name.safeParse(value).error?.issues.map((i) => i.message);

  it('refuses a NUL byte, other control characters and DEL with one clear message', () => {
    for (const bad of ['\u0000', 'a\u0000b', '\u0007', '\u001B[31m', '\u007F', '\u000B', '\u000C']) expect(messages(bad), JSON.stringify(bad)).toEqual([CONTROL_CHARACTER_MESSAGE]);
  });

  it('keeps a single-line field on one line; a multi-line field may hold line breaks and tabs', () => {
    expect(messages('two\nlines')).toEqual([LINE_BREAK_MESSAGE]);
    expect(messages('two\r\nlines')).toEqual([LINE_BREAK_MESSAGE]);
    expect(multilineText().parse('two\r\nlines\twith a tab')).toBe('two\r\nlines\twith a tab');
    expect(multilineText().safeParse('nul \u0000').error?.issues.map((i) => i.message)).toEqual([CONTROL_CHARACTER_MESSAGE]);
  });

  it('refuses a lone surrogate, high or low, and keeps whole emoji and other scripts', () => {
    for (const bad of ['\uD800', 'x\uD83D', '\uDE00x', '\uDE00\uD83D']) expect(messages(bad), JSON.stringify(bad)).toEqual([BROKEN_CHARACTER_MESSAGE]);
    for (const good of ['Boat 🚢', 'Ålesund', 'Øresund', '船 一号', 'tab\there']) expect(name.parse(good)).toBe(good);
  });

  it('keeps its own type message and the checks chained after it', () => {
    expect(messages(42)).toEqual(['Name it.']);
    expect(messages('   ')).toEqual(['Name it.']);
    expect(messages('x'.repeat(21))).toEqual(['Too long.']);
  });

  it('agrees with String.prototype.isWellFormed on surrogates, for any UTF-16 text', () => {
    const utf16 = fc.string({ unit: fc.integer({ min: 0, max: 0xffff }).map((c) => String.fromCharCode(c)), maxLength: 16 });
    fc.assert(
      fc.property(utf16, (value) => {
        const clean = value.replace(/[\u0000-\u001F\u007F]/g, '');
        expect(textProblem(clean, { multiline: true }) === null).toBe((clean as string & { isWellFormed(): boolean }).isWellFormed());
      }),
      { numRuns: 2000 },
    );
  });
});

async function sources(dir: string): Promise<string[]> {
  const entries = await readdir(path.join(ROOT, dir), { recursive: true, withFileTypes: true });
  return entries.filter((e) => e.isFile() && /\.(ts|tsx)$/.test(e.name)).map((e) => path.relative(ROOT, path.join(e.parentPath, e.name)).split(path.sep).join('/'));
}

describe('every string that crosses a boundary goes through text()', () => {
  // The environment is read from the operator's own settings at boot, not from a request.
  const EXEMPT = new Set(['lib/schemas/text.ts', 'lib/server/env.ts']);

  it('no z.string(), z.coerce.string() or z.any() outside lib/schemas/text.ts in app/, lib/ and components/', async () => {
    const offenders: string[] = [];
    for (const file of [...(await sources('app')), ...(await sources('lib')), ...(await sources('components'))]) {
      if (EXEMPT.has(file)) continue;
      const source = await readFile(path.join(ROOT, file), 'utf8');
      source.split('\n').forEach((line, i) => {
        if (/\bz\s*\.\s*(string|coerce\s*\.\s*string|any)\s*\(/.test(line)) offenders.push(`${file}:${i + 1}: ${line.trim()}`);
      });
    }
    expect(offenders).toEqual([]);
  });
});
