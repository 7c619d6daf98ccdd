import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import tailwind from '@/tailwind.config';
import { StatusTag } from '@/components/ui/status-tag';
import { Timeline, DOCKING_KIND_STYLES } from '@/components/planner/timeline';
import { depletionChartHtml, seriesStyle } from '@/components/register/depletion-chart';
import { depletionChartFigure } from '@/lib/figures/depletion-chart';
import { DESIGN_STATUSES } from '@/entities/design.entity';
import { DOCKING_KINDS, DOCKING_STATUSES } from '@/entities/docking.entity';
import { RENEWAL_STATUSES } from '@/entities/renewal.entity';
import { OUTLOOK_WORDS, POTENTIAL_STATUS_LABELS, REMAINING_STATUS_LABELS, SUBSCRIPTION_STATUS_LABELS as SUBSCRIPTION_STATUS_WORDS } from '@/lib/labels';
import {
  DESIGN_STATUS_TONES,
  DOCKING_STATUS_TONES,
  INVOICE_STATUS_TONES,
  OUTLOOK_TONES,
  POTENTIAL_TONES,
  REMAINING_TONES,
  RENEWAL_STATUS_TONES,
  STATUS_TONES,
  SUBSCRIPTION_STATUS_TONES,
  TONE_SPECS,
  toneOf,
  type StatusTone,
} from '@/lib/status/palette';
import type { PlannerDocking } from '@/lib/server/services/planner/planner-view';

// Every stored state has its tone, each tone means one thing, the tags carry a shape besides the colour, the
// colours meet the contrast minimum, and the charts tell their series and kinds apart without colour.

const MAPS: Record<string, { tones: Readonly<Record<string, StatusTone>>; values: readonly string[] }> = {
  'design status': { tones: DESIGN_STATUS_TONES, values: DESIGN_STATUSES },
  'docking status': { tones: DOCKING_STATUS_TONES, values: DOCKING_STATUSES },
  'renewal status': { tones: RENEWAL_STATUS_TONES, values: RENEWAL_STATUSES },
  outlook: { tones: OUTLOOK_TONES, values: Object.keys(OUTLOOK_WORDS) },
  'reading status': { tones: POTENTIAL_TONES, values: Object.keys(POTENTIAL_STATUS_LABELS) },
  'remaining mass': { tones: REMAINING_TONES, values: Object.keys(REMAINING_STATUS_LABELS) },
  subscription: { tones: SUBSCRIPTION_STATUS_TONES, values: Object.keys(SUBSCRIPTION_STATUS_WORDS) },
};

describe('one status palette', () => {
  it.each(Object.entries(MAPS))('every %s stored or reported has a tone of the palette', (_name, { tones, values }) => {
    for (const value of values) {
      expect(tones[value], value).toBeDefined();
      expect(STATUS_TONES).toContain(tones[value]);
    }
  });

  it('under-protection is red for a reading and for the fleet outlook alike; purple is over-protection and nothing else', () => {
    expect(POTENTIAL_TONES['under-protected']).toBe('action');
    expect(OUTLOOK_TONES['under-protected']).toBe('action');
    expect(POTENTIAL_TONES['over-protected']).toBe('over');
    expect(OUTLOOK_TONES['over-protected']).toBe('over');
    const purple = Object.entries({ ...MAPS, invoice: { tones: INVOICE_STATUS_TONES, values: Object.keys(INVOICE_STATUS_TONES) } }).flatMap(([name, { tones }]) =>
      Object.entries(tones)
        .filter(([, tone]) => tone === 'over')
        .map(([value]) => `${name}: ${value}`),
    );
    expect(purple).toEqual(['outlook: over-protected', 'reading status: over-protected']);
  });

  it('a workflow state never borrows the amber of "due soon": a checked design is in progress, overdue payment is red', () => {
    expect(DESIGN_STATUS_TONES.checked).toBe('progress');
    expect(DESIGN_STATUS_TONES.approved).toBe('sound');
    expect(SUBSCRIPTION_STATUS_TONES.past_due).toBe('action');
    expect(DOCKING_STATUS_TONES.planned).toBe('progress');
  });

  it('each tone has its own colour and its own shape', () => {
    const specs = STATUS_TONES.map((t) => TONE_SPECS[t]);
    expect(new Set(specs.map((s) => s.colour)).size).toBe(STATUS_TONES.length);
    expect(new Set(specs.map((s) => s.shape)).size).toBe(STATUS_TONES.length);
  });

  it('an unknown value is neutral rather than a guess', () => {
    expect(toneOf(INVOICE_STATUS_TONES, 'something-new')).toBe('neutral');
    expect(toneOf(INVOICE_STATUS_TONES, null)).toBe('neutral');
    expect(toneOf(INVOICE_STATUS_TONES, 'open')).toBe('soon');
  });

  it.each(STATUS_TONES)('the %s tag shows its word and its shape', (tone) => {
    const html = renderToStaticMarkup(createElement(StatusTag, { tone, children: 'Word of the state' }));
    expect(html).toContain('Word of the state');
    expect(html).toContain(`data-shape="${TONE_SPECS[tone].shape}"`);
    expect(html).toContain(`data-tone="${tone}"`);
  });
});

// WCAG 2.1, 1.4.3 Contrast (Minimum): 4.5:1 for text; relative luminance as defined in WCAG 2.1.
function luminance(hex: string): number {
  const [r, g, b] = (hex.replace('#', '').match(/../g) ?? []).map((x) => {
    const c = parseInt(x, 16) / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}
const contrast = (a: string, b: string) => {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
};

describe('contrast of the palette (WCAG 2.1 AA, 4.5:1 for text)', () => {
  const colours = tailwind.theme!.extend!.colors as Record<string, Record<string, string>>;
  const papers = [colours.paper.DEFAULT, colours.paper.raised, colours.paper.sunk];

  it('faint ink reads on every paper', () => {
    for (const paper of papers) expect(contrast(colours.ink.faint, paper), `ink-faint on ${paper}`).toBeGreaterThanOrEqual(4.5);
  });

  it.each(['action', 'soon', 'sound', 'progress', 'over'])('the %s text reads on its own background and on paper', (tone) => {
    const text = colours.state[tone];
    expect(contrast(text, colours.state[`${tone}bg`])).toBeGreaterThanOrEqual(4.5);
    for (const paper of papers) expect(contrast(text, paper), `${tone} on ${paper}`).toBeGreaterThanOrEqual(4.5);
  });

  it('each status colour has one name: the palette holds the tones and their backgrounds, no older second names', () => {
    const tones = ['action', 'soon', 'sound', 'progress', 'over'];
    expect(Object.keys(colours.state).sort()).toEqual(tones.flatMap((t) => [t, `${t}bg`]).sort());
    expect(new Set(Object.values(colours.state)).size).toBe(Object.keys(colours.state).length);
  });
});

describe('charts that read in grey print', () => {
  it('no two of the first 40 depletion series share dash and marker; series i and i + 4 differ in more than colour', () => {
    const looks = Array.from({ length: 40 }, (_, i) => seriesStyle(i));
    expect(new Set(looks.map((s) => `${s.dash}|${s.marker}`)).size).toBe(40);
    expect(new Set(looks.map((s) => s.letter)).size).toBe(40);
    for (let i = 0; i < 36; i++) {
      expect(looks[i].dash, `dash of ${i} and ${i + 4}`).not.toBe(looks[i + 4].dash);
      expect(looks[i].marker, `marker of ${i} and ${i + 4}`).not.toBe(looks[i + 4].marker);
    }
  });

  it('the drawn chart gives each group its own dash, marker and letter, in the lines and the legend', () => {
    const day = (iso: string) => new Date(`${iso}T00:00:00Z`);
    const series = Array.from({ length: 6 }, (_, i) => ({
      label: `Group ${i + 1}`,
      points: [{ date: day('2025-01-01'), kg: 100 }, { date: day('2026-01-01'), kg: 70 - i }, { date: day('2027-01-01'), kg: 40 - i }, { date: day('2028-01-01'), kg: 10 }],
      surveys: [],
      endKg: 10,
      endOfLife: null,
    }));
    // The lines are in the chart's image (its own SVG document), the legend in the page.
    const figure = depletionChartFigure({ series, today: day('2026-06-01') })!;
    const html = depletionChartHtml({ series, figure, src: '/chart.svg' }).value;
    const groups = [...figure.document.matchAll(/data-series="([A-Z]+)" data-dash="([^"]*)" data-marker="([a-z]+)"/g)].map((m) => ({ letter: m[1], dash: m[2], marker: m[3] }));
    expect(groups.map((g) => g.letter)).toEqual(['A', 'B', 'C', 'D', 'E', 'F']);
    expect(new Set(groups.map((g) => g.dash)).size).toBe(6);
    expect(new Set(groups.map((g) => g.marker)).size).toBe(5); // five marker shapes; the sixth repeats the first with another dash
    for (const g of groups) expect(html).toMatch(new RegExp(`<strong[^>]*>${g.letter}</strong> Group`));
  });

  it('each kind of docking has its own fill pattern and letter, and a done docking says so in words', () => {
    const styles = DOCKING_KINDS.map((k) => DOCKING_KIND_STYLES[k]);
    expect(styles.every(Boolean)).toBe(true);
    expect(new Set(styles.map((s) => s.pattern)).size).toBe(DOCKING_KINDS.length);
    expect(new Set(styles.map((s) => s.letter)).size).toBe(DOCKING_KINDS.length);

    const docking = (id: string, kind: string, status: 'planned' | 'done'): PlannerDocking => ({ id, assetId: 'a1', assetName: 'Skerry Wren', assetKind: 'vessel', kind, status, start: '2027-03-14', end: '2027-03-28', yard: null, renewals: 0, openRenewals: 0, massDueKg: 0 }) as PlannerDocking;
    const html = renderToStaticMarkup(
      createElement(Timeline, {
        org: 'o',
        assets: [{ id: 'a1', name: 'Skerry Wren', kind: 'vessel' }],
        dockings: [docking('d1', 'renewal-survey', 'done'), docking('d2', 'unplanned', 'planned')],
        needsDocking: [],
        today: new Date(Date.UTC(2027, 0, 10)),
      }),
    );
    expect(html).toContain('data-kind-pattern="diagonal"');
    expect(html).toContain('data-kind-pattern="cross"');
    expect(html).toMatch(/>done<\/text>/);
    // Links inside an image are hidden from assistive technology: the timeline is a figure, its bars named links.
    expect(html).not.toContain('role="img"');
    expect(html).toContain('<figure aria-label="Docking timeline"');
    expect(html).toMatch(/<a [^>]*aria-label="Skerry Wren: [^"]*; done"/);
  });
});
