import { describe, expect, it } from 'vitest';
import { safeNextPath } from '@/lib/server/safe-redirect';

const ORIGIN = 'https://tidewarden.example';

// Every target below must come back as the fallback: each one either leaves our origin in some
// browser's reading or is too odd to guess at.
const hostile: string[] = [
  '//evil.example',
  '//evil.example/o/gullhaven',
  '///evil.example',
  '/\\evil.example',
  '\\\\evil.example',
  '/\t/evil.example',
  '/\t/other-host/sign-in',
  '/\n/evil.example',
  '/\r\n/evil.example',
  '/%0d%0aSet-Cookie:%20x=1'.replace('%0d%0a', '\r\n'),
  '/.//evil.example',
  '/./\\evil.example',
  '/a/..//evil.example',
  '/%2e//evil.example',
  '/%2e%2e//evil.example',
  '/orgs/../..//evil.example/x',
  'https://evil.example',
  'http:evil.example',
  'http:/evil.example',
  'javascript:alert(1)',
  'JaVaScRiPt:alert(1)',
  ' /orgs',
  'data:text/html,<script>alert(1)</script>',
  'evil.example',
  '',
  '/\u0000/evil.example',
  '/\u007f/evil.example',
  '/\uD800/evil.example',
  `/${'a'.repeat(2100)}`,
  '\u2215\u2215evil.example',
  '\uFF0F\uFF0Fevil.example',
];

const legitimate: [string, string][] = [
  ['/o/gullhaven/assets?x=1#y', '/o/gullhaven/assets?x=1#y'],
  ['/orgs', '/orgs'],
  ['/invite/abc123', '/invite/abc123'],
  ['/o/gullhaven', '/o/gullhaven'],
  ['/o/gullhaven/planner?asset=7f3c&from=2026-01-01', '/o/gullhaven/planner?asset=7f3c&from=2026-01-01'],
  // Not a host: a percent-encoded slash stays part of the path.
  ['/%2F%2Fevil.example', '/%2F%2Fevil.example'],
  ['/o/gull%20haven', '/o/gull%20haven'],
  ['/o/å', '/o/%C3%A5'],
];

describe('safeNextPath', () => {
  it.each(hostile.map((v) => [JSON.stringify(v).slice(0, 80), v]))('refuses %s', (_label, value) => {
    expect(safeNextPath(value)).toBe('/orgs');
  });

  it('refuses what is not a string', () => {
    for (const value of [undefined, null, 42, ['/orgs'], { toString: () => '/orgs' }]) expect(safeNextPath(value)).toBe('/orgs');
  });

  it('has a corpus of at least 25 hostile targets', () => {
    expect(hostile.length).toBeGreaterThanOrEqual(25);
  });

  it.each(legitimate)('keeps %s', (value, expected) => {
    expect(safeNextPath(value)).toBe(expected);
  });

  it('never returns a target that a browser resolves to another origin', () => {
    for (const value of [...hostile, ...legitimate.map(([v]) => v)]) {
      const target = safeNextPath(value);
      expect(new URL(target, ORIGIN).origin).toBe(ORIGIN);
      expect(target).toMatch(/^\/(?![/\\])/);
    }
  });
});
