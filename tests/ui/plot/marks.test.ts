/**
 * Plot marks render headless (strings, no document): scales invert exactly, ticks are
 * round numbers, the heatmap merges runs of equal cells, the categorical contour draws
 * exactly the edges between unequal cells. Checks are counts and closed forms computed here
 * (common practice, no source).
 */
import { describe, it, expect } from 'vitest';
import { linearScale, niceTicks } from '../../../src/ui/plot/scale.ts';
import { makeFrame } from '../../../src/ui/plot/frame.ts';
import { heatmap } from '../../../src/ui/plot/heatmap.ts';
import { categoryContour } from '../../../src/ui/plot/contour.ts';
import { renderFigure } from '../../../src/ui/plot/figure.ts';
import { axisX, axisY } from '../../../src/ui/plot/axis.ts';
import { legend } from '../../../src/ui/plot/legend.ts';
import { esc } from '../../../src/ui/plot/svg-markup.ts';

describe('scales and ticks', () => {
  it('a linear scale inverts itself', () => {
    const s = linearScale([-1, 3], [50, 450]);
    expect(s(-1)).toBe(50);
    expect(s(3)).toBe(450);
    // one multiply and one divide each way: exact to a few ulps, 1e-12 relative
    for (const v of [-0.7, 0, 1.234, 2.999]) expect(Math.abs(s.invert(s(v)) - v)).toBeLessThan(1e-12);
  });

  it('ticks are round steps of 1, 2 or 5 times a power of ten inside the domain', () => {
    expect(niceTicks(0, 1, 5)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(niceTicks(-1, 2.9, 6)).toEqual([-1, -0.5, 0, 0.5, 1, 1.5, 2, 2.5]);
    expect(niceTicks(0.8, 2.4, 8)).toEqual([0.8, 1, 1.2, 1.4, 1.6, 1.8, 2, 2.2, 2.4]);
  });
});

describe('heatmap and contour', () => {
  // 4 x 2 grid: row 0 = A A B B, row 1 = A A A B
  const key = (i: number, j: number) => (j === 0 ? (i < 2 ? 'A' : 'B') : i < 3 ? 'A' : 'B');
  const grid = { nx: 4, ny: 2, x: [0, 3] as const, y: [0, 1] as const };
  const f = makeFrame({ width: 400, height: 200, x: [-0.5, 3.5], y: [-0.5, 1.5] });

  it('merges each row into runs of equal cells', () => {
    const svg = heatmap(grid, (i, j) => ({ key: key(i, j), fill: key(i, j) === 'A' ? '#111' : '#eee' })).render(f);
    expect(svg.match(/<rect/g)?.length).toBe(4); // two runs per row
  });

  it('leaves cells without a value blank', () => {
    const svg = heatmap(grid, (i, j) => (i === 0 && j === 0 ? null : { key: 'A', fill: '#111' })).render(f);
    expect(svg.match(/<rect/g)?.length).toBe(2); // row 0: cells 1..3; row 1: all
  });

  it('draws the boundary along the unequal edges only', () => {
    const d = /d="([^"]+)"/.exec(categoryContour(grid, key, { stroke: '#000' }).render(f))?.[1] ?? '';
    // vertical edges: between i=1,2 in row 0 and between i=2,3 in row 1; horizontal: cell i=2 between rows
    expect(d.match(/M/g)?.length).toBe(3);
  });
});

describe('figure', () => {
  it('is one standalone SVG document with a title, axes labels with units and a legend', () => {
    const { svg } = renderFigure({
      width: 500, height: 300, x: [0, 1], y: [0, 1], title: 'A <test> figure',
      marks: [axisX({ label: 'mu (g)' }), axisY({ label: 'rho' }), legend([{ label: 'line', swatch: { kind: 'line', stroke: '#000' } }])],
    });
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(svg).toContain(`<title id="fig-title">${esc('A <test> figure')}</title>`);
    expect(svg).toContain('>mu (g)</text>');
    expect(svg).toContain('class="legend"');
    expect(svg.endsWith('</svg>')).toBe(true);
  });
});
