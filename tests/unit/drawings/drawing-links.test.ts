import { describe, expect, it } from 'vitest';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { DrawingSvg } from '@/components/drawings/drawing-svg';
import { pilePlanView, pileStates } from '@/lib/drawings/pile-plan';
import { parsePosition } from '@/lib/drawings/parse-position';

describe('the links on a drawing', () => {
  it('give each linked group a <title>, so a pointer shows its words as a tooltip', () => {
    const grid = { rows: 1, bents: 2 };
    const view = pilePlanView('Plan', grid, pileStates(grid, [{ id: 'g', label: 'G', quantity: 1, position: parsePosition('bent 1 row A', 'structure'), remainingFraction: 0.5 }], []));
    const html = renderToStaticMarkup(createElement(DrawingSvg, { view, idPrefix: 't' }));
    expect(html).toContain('<a href="#pile-1-A" aria-label="Pile bent 1 row A: 1 anode, 50 % left"><title>Pile bent 1 row A: 1 anode, 50 % left</title>');
  });
});
