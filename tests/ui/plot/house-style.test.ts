/**
 * The house style as rendered: open axes (a left and a bottom spine set off the plot area,
 * nothing along the top or the right), ticks into the gap or outwards as asked, dotted
 * guides for a grid, the key above the plot, the density-wave shades with a scale, and
 * every paint resolved in the SVG itself (no CSS variable, no currentColor), so the file
 * saved is the figure shown. Checks are geometry and text of the markup (common practice,
 * no source).
 */
import { describe, expect, it } from 'vitest';
import { renderFigure } from '../../../src/ui/plot/figure.ts';
import { axisX, axisY } from '../../../src/ui/plot/axis.ts';
import { legend } from '../../../src/ui/plot/legend.ts';
import { line } from '../../../src/ui/plot/line.ts';
import { phaseMapFigure } from '../../../src/ui/figures/phase-map-figure.ts';
import { staircaseFigure } from '../../../src/ui/figures/staircase-figure.ts';
import { seriesFigure } from '../../../src/ui/figures/series-figure.ts';
import { densityWaveColour, PHASE_COLOURS } from '../../../src/ui/plot/phase-palette.ts';
import { SPINE_GAP, TICK_LENGTH } from '../../../src/ui/plot/house-style.ts';
import type { SolveResult } from '../../../src/core/meanfield/ground-state.ts';

const state = (phase: string, fraction: string | null, coexistence: unknown = null) => ({
  phase, fraction, cellSize: 2, sublatticeDensities: [1, 0], photonDensity: 0.1, emitterDensity: 0.5, excitationDensity: 0.5, coexistence,
} as unknown as SolveResult);

/** Every fill and stroke value of the markup. */
const paints = (svg: string) => [...svg.matchAll(/\b(fill|stroke)="([^"]*)"/g)].map((m) => m[2]);
const RESOLVED = /^(#[0-9a-f]{6}|#[0-9a-f]{3}|none|url\(#[\w-]+\)|hsl\(\d+ \d+% \d+%\)|rgba\(\d+,\d+,\d+,[\d.]+\))$/i;

const plain = (o: { tickDirection?: 'in' | 'out'; grid?: boolean } = {}) => renderFigure({
  width: 500, height: 300, x: [0, 1], y: [0, 1], title: 't',
  marks: [line([0, 1], [0, 1], { stroke: '#3a3f9e' }), axisX({ label: 'mu (g)', ...o }), axisY({ label: 'rho', ...o }),
    legend([{ label: 'a line', swatch: { kind: 'line', stroke: '#3a3f9e' } }])],
});

describe('open axes, ticks, guides, key', () => {
  it('draws a left and a bottom spine set off the plot area, and no frame round it', () => {
    const { svg, frame: f } = plain();
    const { x0, x1, y0, y1 } = f.inner;
    const spines = [...svg.matchAll(/<line x1="([\d.]+)" x2="([\d.]+)" y1="([\d.]+)" y2="([\d.]+)"/g)].map((m) => m.slice(1).map(Number))
      .filter(([a, b, c, d]) => Math.abs(b - a) > 100 || Math.abs(d - c) > 100);
    expect(spines).toEqual([[x0, x1, y1 + SPINE_GAP, y1 + SPINE_GAP], [x0 - SPINE_GAP, x0 - SPINE_GAP, y0, y1]]);
    expect(svg).not.toMatch(/<rect[^>]*stroke=/); // no box
  });

  it('points ticks into the gap by default and away from the plot when asked', () => {
    const tickEnds = (svg: string, y: number) => [...svg.matchAll(/<line x1="([\d.]+)" x2="\1" y1="([\d.]+)" y2="([\d.]+)"/g)]
      .filter((m) => Number(m[2]) === y).map((m) => Number(m[3]) - Number(m[2]));
    const inward = plain(), outward = plain({ tickDirection: 'out' });
    const Y = inward.frame.inner.y1 + SPINE_GAP;
    expect(new Set(tickEnds(inward.svg, Y))).toEqual(new Set([-TICK_LENGTH]));
    expect(new Set(tickEnds(outward.svg, Y))).toEqual(new Set([TICK_LENGTH]));
  });

  it('a grid is dotted guides, not solid lines', () => {
    const { svg } = plain({ grid: true });
    const guides = svg.match(/stroke-dasharray="1 3"/g) ?? [];
    expect(guides.length).toBeGreaterThan(4);
  });

  it('puts the key above the plot area, the figure growing to hold it', () => {
    const { svg, frame: f } = plain();
    expect(f.height).toBeGreaterThan(300);
    const y = Number(/<g class="legend" data-place="above">.*?<text x="[\d.]+" y="([\d.]+)"/.exec(svg)?.[1]);
    expect(y).toBeLessThan(f.inner.y0);
  });
});

describe('the phase map', () => {
  // 6 x 4 grid: empty, normal, two density waves, a supersolid and a filled column; a coexistence cell
  const cols = [state('empty', null), state('normal', null), state('density-wave', '1/3'), state('density-wave', '1/2'), state('supersolid', '1/2'), state('filled', null)];
  const fig = (width: number) => phaseMapFigure({
    grid: { nx: 6, ny: 4, x: [0, 1], y: [0, 1] }, stateAt: (i, j) => (i === 1 && j === 0 ? state('normal', null, { phases: [], fractions: [] }) : cols[i]),
    xLabel: 'mu (g)', yLabel: 'Rb (a)', shade: 'phase', lines: [], width, height: 360, title: 'map',
  });

  it('fills filled and empty with quiet colours and draws boundaries in ink over them', () => {
    const { svg } = fig(900);
    expect(svg).toContain(`fill="${PHASE_COLOURS.filled}"`);
    expect(svg).toMatch(/<path d="[^"]+" fill="none" stroke="#1f2430"/); // the contour
  });

  it('gives the density-wave shades a scale with a tick at each filling on the map', () => {
    const { svg } = fig(900);
    const bar = svg.slice(svg.indexOf('class="colour-bar"'), svg.indexOf('</g>', svg.indexOf('class="colour-bar"')));
    expect(bar).toContain('>Density-wave</text>');
    expect(bar).toContain('>1/3</text>');
    expect(bar).toContain('>1/2</text>');
    // the bar is the fill ramp itself: its lowest and highest steps are the ramp at their centres
    const steps = [...bar.matchAll(/<rect[^>]*height="[\d.]+" fill="(#[0-9a-f]{6})"/g)].map((m) => m[1]);
    expect(steps[0]).toBe(densityWaveColour(0.5 / steps.length));
    expect(steps[steps.length - 1]).toBe(densityWaveColour(1 - 0.5 / steps.length));
  });

  it('exports with every paint resolved: no CSS variables, no currentColor', () => {
    for (const w of [900, 420]) {
      const { svg } = fig(w);
      expect(svg).not.toMatch(/var\(|currentColor/);
      for (const p of paints(svg)) expect(p).toMatch(RESOLVED);
    }
  });
});

describe('other figures export resolved paints', () => {
  it('staircase and series figures', () => {
    const mu = [0, 0.5, 1, 1.5, 2], rho = [0, 0.5, 0.5, 0.5, 1];
    const plateaus = [{ fraction: '1/2', muLow: 0.5, muHigh: 1.5, width: 1, points: 3, openLow: false, openHigh: false }];
    const s = { label: 'r<=1', mu, rho, filling: rho, plateaus } as never;
    const svgs = [
      staircaseFigure(s, { ...(s as object), label: 'full' } as never, 3, 900, 400).svg,
      seriesFigure({ id: 's', name: 's', title: 't', width: 700, height: 300, x: { label: 'x' }, y: { label: 'y', grid: true },
        series: [{ label: 'a', x: mu, y: rho, err: rho.map(() => 0.1), stroke: '#3a3f9e', points: true }], refs: [{ axis: 'y', value: 0.5, label: 'ref', stroke: '#8e1f2c' }] }).svg,
    ];
    for (const svg of svgs) {
      expect(svg).not.toMatch(/var\(|currentColor/);
      for (const p of paints(svg)) expect(p).toMatch(RESOLVED);
    }
  });
});
