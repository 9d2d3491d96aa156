// Continuous map colourings (issue 11, item 10): a diverging photon density must not paint
// every other point in one colour. Values built by hand; exact comparisons (closed forms of
// the linear and log maps, common practice, no source).
import { describe, it, expect } from 'vitest';
import { colourScale, parseColourRange } from '../../../src/ui/figures/colour-scale.ts';
import { phaseMapFigure } from '../../../src/ui/figures/phase-map-figure.ts';
import type { SolveResult } from '../../../src/core/meanfield/ground-state.ts';

// 19 ordinary values 0.00..0.18 and one near the divergence at mu -> delta
const values = [...Array.from({ length: 19 }, (_, i) => i * 0.01), 24.3];

describe('colour scale', () => {
  it('clips at the 95th percentile by default, so the physical range keeps its colours', () => {
    const s = colourScale(values, {}, false);
    expect(s.hi).toBe(0.18); // floor(0.95 * 19) = 18th sorted value
    expect(s.clippedHigh).toBe(true);
    expect(s.t(0.09)).toBeCloseTo(0.5, 12);
    expect(s.t(24.3)).toBe(1);
  });

  it('a log scale and a typed range', () => {
    const s = colourScale(values, { lo: 0.01, hi: 10 }, true);
    expect(s.t(0.1)).toBeCloseTo(1 / 3, 12); // log10: -2 .. 1, -1 is a third of the way
    expect(s.at(2 / 3)).toBeCloseTo(1, 12);
    expect(s.clippedLow).toBe(true); // the value 0 lies below 0.01
    expect(parseColourRange('0:2')).toEqual({ lo: 0, hi: 2 });
    expect(parseColourRange(':5')).toEqual({ lo: undefined, hi: 5 });
    expect(parseColourRange('3:1')).toBeNull();
  });

  it('the map figure draws a colour bar saying where it clips, and many colours below it', () => {
    const st = (v: number) => ({ phase: 'superradiant', fraction: null, photonDensity: v, excitationDensity: v } as unknown as SolveResult);
    const states = values.map(st);
    const fig = phaseMapFigure({
      grid: { nx: 20, ny: 1, x: [0, 1], y: [0, 0] }, stateAt: (i) => states[i], xLabel: 'x', yLabel: 'y',
      shade: 'photon', lines: [], width: 800, height: 300, title: 't',
    });
    expect(fig.svg).toContain('class="colour-bar"');
    expect(fig.svg).toContain('above: clipped');
    const heat = fig.svg.slice(fig.svg.indexOf('class="heatmap"'));
    const cells = heat.slice(0, heat.indexOf('</g>'));
    const fills = new Set([...cells.matchAll(/fill="(hsl[^"]+)"/g)].map((m) => m[1]));
    expect(fills.size).toBeGreaterThanOrEqual(15);
  });
});
