// The map figure draws the boundary lines a scan returns (issue 9, "The page draws these
// lines") as vector polylines at their own coordinates (rounded to 0.01 px), first-order lines
// heavier than approximate ones, with legend entries, in place of the pixel-edge contour.
// States and lines built by hand; expected paths computed here from the figure's frame
// (common practice, no source).
import { describe, it, expect } from 'vitest';
import { phaseMapFigure, type PhaseMapInput } from '../../../src/ui/figures/phase-map-figure.ts';
import type { SolveResult } from '../../../src/core/meanfield/ground-state.ts';
import type { Boundary } from '../../../src/core/scan/boundaries.ts';
import type { Frame } from '../../../src/ui/plot/frame.ts';
import { px } from '../../../src/ui/plot/svg-markup.ts';
import { FIRST_ORDER_STYLE, APPROXIMATE_STYLE } from '../../../src/ui/figures/boundary-lines.ts';
import { SOFT_RANGES } from '../../../src/ui/controllers/soft-lines.ts';
import { contrastRatio } from '../plot/colour-science.ts';

const wave = (M: number) => ({
  phase: 'density-wave', fraction: `1/${M}`, cellSize: M, sublatticeDensities: [1, ...Array(M - 1).fill(0)],
  photonDensity: 0, emitterDensity: 1 / M, excitationDensity: 1 / M, coexistence: null,
} as unknown as SolveResult);
const half = wave(2), third = wave(3);

// 12 x 8 grid over [0, 1] x [0, 1]: 1/2 left of column 6, 1/3 right of it
const input = (boundaries?: Boundary[]): PhaseMapInput => ({
  grid: { nx: 12, ny: 8, x: [0, 1], y: [0, 1] }, stateAt: (i) => (i < 6 ? half : third), xLabel: 'x', yLabel: 'y',
  shade: 'phase', lines: [], width: 800, height: 300, title: 't', boundaries,
});

// a first-order line between the two waves, not on a pixel edge, and an approximate one
const lines: Boundary[] = [
  { phases: ['density-wave 1/2', 'density-wave 1/3'], points: [[0.4987654, -0.1], [0.4912345, 0.5], [0.5031, 1.1]], firstOrder: true, densityJump: -1 / 6 },
  { phases: ['density-wave 1/3', 'supersolid 1/3'], points: [[0.7, 0.3333333], [1.1, 0.2777777]], firstOrder: null, densityJump: null },
];

const expectedPath = (f: Frame, pts: number[][]) => pts.map((p, k) => `${k ? 'L' : 'M'}${px(f.x(p[0]))} ${px(f.y(p[1]))}`).join('');
/** The `d` and `stroke-width` of each stroked (not halo) path of the boundary group. */
function boundaryPaths(svg: string): { d: string; width: number }[] {
  const at = svg.indexOf('class="polylines boundaries"');
  if (at < 0) return [];
  const group = svg.slice(at, svg.indexOf('</g>', at));
  return [...group.matchAll(/<path d="([^"]+)"[^>]*stroke="#111827" stroke-width="([\d.]+)"/g)].map((m) => ({ d: m[1], width: Number(m[2]) }));
}

describe('boundary lines on the phase map', () => {
  it('draws each line as a vector polyline at its rounded coordinates, first order heavier', () => {
    const fig = phaseMapFigure(input(lines));
    const paths = boundaryPaths(fig.svg);
    expect(paths).toHaveLength(2);
    // approximate first (drawn under), then first order
    expect(paths[0].d).toBe(expectedPath(fig.frame, lines[1].points));
    expect(paths[1].d).toBe(expectedPath(fig.frame, lines[0].points));
    expect(paths[1].width).toBe(FIRST_ORDER_STYLE.width);
    expect(paths[0].width).toBe(APPROXIMATE_STYLE.width);
    expect(paths[1].width).toBeGreaterThan(paths[0].width);
    // coordinates are the line's own, to 0.01 px (not snapped to pixel edges)
    for (const p of paths) for (const v of p.d.split(/[ML ]/).filter(Boolean)) expect(v).toMatch(/^-?\d+(\.\d{1,2})?$/);
    // the tooltip names the phases and the density jump
    expect(fig.svg).toContain('<title>density-wave 1/2 | density-wave 1/3: first order, \u0394\u03c1 = -0.167</title>');
    // legend entries for both kinds; the pixel-edge contour is replaced
    expect(fig.svg).toContain('boundary, first order');
    expect(fig.svg).toContain('boundary, \u00b1\u00bd pixel');
    expect(fig.svg).not.toContain('stroke-linecap="square"');
  });

  it('keeps the fraction labels inside their regions', () => {
    const fig = phaseMapFigure(input(lines));
    // the labels' own group (the density-wave scale beside the map also writes fillings)
    const start = fig.svg.indexOf('fraction-labels');
    const labels = fig.svg.slice(start, fig.svg.indexOf('</g>', start));
    const xs = (t: string) => [...labels.matchAll(new RegExp(`<text[^>]*x="([\\d.]+)"[^>]*>${t}</text>`, 'g'))].map((m) => Number(m[1]));
    const edge = fig.frame.x(0.5);
    expect(xs('1/2').length).toBeGreaterThan(0);
    expect(xs('1/3').length).toBeGreaterThan(0);
    for (const x of xs('1/2')) expect(x).toBeLessThan(edge);
    for (const x of xs('1/3')) expect(x).toBeGreaterThan(edge);
  });

  it('without lines from the scan (running, or a dense map) the pixel-edge contour stays', () => {
    const fig = phaseMapFigure(input());
    expect(boundaryPaths(fig.svg)).toHaveLength(0);
    expect(fig.svg).toContain('stroke-linecap="square"');
    expect(fig.svg).not.toContain('boundary, first order');
    // an empty list: the scan located no boundary, nothing is drawn and nothing is named
    const none = phaseMapFigure(input([]));
    expect(none.svg).not.toContain('polylines boundaries');
    expect(none.svg).not.toContain('stroke-linecap="square"');
  });
});

describe('soft-mode lines do not look like boundary lines', () => {
  // A line's meaning is told by its style (common practice, no source): a soft-mode line
  // drawn solid must differ in lightness from the solid first-order boundary by at least
  // WCAG 2.1's 3:1 non-text contrast (W3C Recommendation 2018, SC 1.4.11; lightness survives
  // every colour-vision deficiency), and a dashed one must not use the approximate
  // boundary's dash.
  it('every range style differs from both boundary styles', () => {
    for (const s of SOFT_RANGES) {
      if (!s.dash) expect(contrastRatio(s.stroke, FIRST_ORDER_STYLE.stroke), s.label).toBeGreaterThanOrEqual(3);
      else expect(s.dash, s.label).not.toBe(APPROXIMATE_STYLE.dash);
    }
  });
});
