import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROLE_STYLES } from '@/components/drawings/drawing-svg';

// The page draws the shapes with classes (app/globals.css), the PDFs with ROLE_STYLES: the same look in both.
const css = fs.readFileSync(path.join(process.cwd(), 'app', 'globals.css'), 'utf8');

describe('drawing styles', () => {
  it.each(Object.entries(ROLE_STYLES))('.dw-%s in the page CSS matches the PDF style', (role, s) => {
    const rule = new RegExp(`^\\s*\\.dw-${role} \\{([^}]*)\\}`, "m").exec(css);
    expect(rule, `.dw-${role} is missing from app/globals.css`).not.toBeNull();
    const decl = Object.fromEntries(rule![1]!.split(';').map((d) => d.trim()).filter(Boolean).map((d) => d.split(/:\s*/) as [string, string]));
    expect(decl.fill).toBe(s.fill?.startsWith('pattern:') ? `url(#dw-${s.fill.slice(8)})` : (s.fill ?? 'none'));
    expect(decl.stroke).toBe(s.stroke);
    expect(decl['stroke-width']).toBe(s.strokeWidth?.toString());
    expect(decl['stroke-dasharray']).toBe(s.strokeDasharray);
    expect(decl['font-size']).toBe(s.fontSize ? `${s.fontSize}px` : undefined);
  });

  it('uses greys only, so a drawing prints the same in grey', () => {
    const colours = JSON.stringify(ROLE_STYLES).match(/#[0-9a-f]{6}/gi) ?? [];
    expect(colours.length).toBeGreaterThan(10);
    for (const c of colours) expect(c.slice(1, 3)).toBe(c.slice(3, 5)), expect(c.slice(3, 5)).toBe(c.slice(5, 7));
  });
});
