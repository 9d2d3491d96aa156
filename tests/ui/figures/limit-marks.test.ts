// Points whose best pattern used the largest cell searched (issue 11, item 11) are marked on
// the map and named in its legend. States built by hand; exact counts (common practice, no source).
import { describe, it, expect } from 'vitest';
import { phaseMapFigure } from '../../../src/ui/figures/phase-map-figure.ts';
import type { SolveResult } from '../../../src/core/meanfield/ground-state.ts';

describe('cell-limit marks', () => {
  it('marks exactly the points at M = Mmax', () => {
    const st = (M: number) => ({ phase: 'density-wave', fraction: `1/${M}`, cellSize: M, sublatticeDensities: [1, ...Array(M - 1).fill(0)],
      photonDensity: 0, emitterDensity: 1 / M, excitationDensity: 1 / M, coexistence: null } as unknown as SolveResult);
    // 6 x 4 grid: three points at M = 8 (the limit), the rest at M = 2
    const at = (i: number, j: number) => st((i === 1 && j === 1) || (i === 4 && j === 2) || (i === 5 && j === 3) ? 8 : 2);
    const fig = phaseMapFigure({
      grid: { nx: 6, ny: 4, x: [0, 1], y: [0, 1] }, stateAt: at, xLabel: 'x', yLabel: 'y',
      shade: 'phase', lines: [], width: 800, height: 300, title: 't', maxCell: 8,
    });
    const g = fig.svg.slice(fig.svg.indexOf('class="dots at-limit"'));
    expect(g.slice(0, g.indexOf('</g>')).match(/<circle/g)?.length).toBe(3);
    expect(fig.svg).toContain('M = Mmax = 8 (search limit)');
    const none = phaseMapFigure({
      grid: { nx: 6, ny: 4, x: [0, 1], y: [0, 1] }, stateAt: () => st(2), xLabel: 'x', yLabel: 'y',
      shade: 'phase', lines: [], width: 800, height: 300, title: 't', maxCell: 8,
    });
    expect(none.svg).not.toContain('at-limit');
  });
});
