/**
 * The phase map: a heatmap of the phase at each grid point (or of a continuous quantity),
 * region boundaries as a categorical contour (or, once the scan has located them, as vector
 * polylines: boundary-lines.ts), the fraction written inside density-wave and supersolid regions, soft-mode lines as polylines, the opened point as a ring, axes with units and a legend. Built from marks only.
 */
import { atSearchLimit } from '../../core/meanfield/plateaus.ts';
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import type { PhaseLabel } from '../../core/meanfield/state.ts';
import { renderFigure } from '../plot/figure.ts';
import { type CellPaint, type Grid, heatmap, halfStep } from '../plot/heatmap.ts';
import { categoryContour } from '../plot/contour.ts';
import { axisX, axisY } from '../plot/axis.ts';
import { legend, legendBelowHeight, type LegendEntry } from '../plot/legend.ts';
import { line } from '../plot/line.ts';
import { dots } from '../plot/dot.ts';
import { textLabels } from '../plot/text-label.ts';
import type { Mark } from '../plot/frame.ts';
import { densityWaveColour, fractionValue, phaseFill, phaseLegend, phaseTexture, textureDefs } from '../plot/phase-palette.ts';
import { INK } from '../plot/house-style.ts';
import { rampColour } from './sequential-ramp.ts';
import { colourScale } from './colour-scale.ts';
import { colourBar } from '../plot/colour-bar.ts';
import { regionLabels } from './region-labels.ts';
import { regionWord } from '../model/phase-words.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import type { Boundary } from '../../core/scan/boundaries.ts';
import { boundaryLines } from './boundary-lines.ts';

export type MapShade = 'phase' | 'rho' | 'photon';

export interface SoftLineOverlay { label: string; stroke: string; dash?: string; x: number[]; y: number[] }

export interface PhaseMapInput {
  grid: Grid;
  /** State painting cell (ix, iy), or undefined while not computed. */
  stateAt: (ix: number, iy: number) => SolveResult | undefined;
  xLabel: string;
  yLabel: string;
  shade: MapShade;
  lines: SoftLineOverlay[];
  selected?: [number, number] | null;
  /** Continuous colourings: the range asked for (ends left out: automatic, see colour-scale.ts) and a log scale. */
  colourRange?: { lo?: number; hi?: number };
  /** Largest cell searched: region labels tell a locked filling from a pattern, and points whose best cell has this size are marked. */
  maxCell?: number;
  log?: boolean;
  /** Boundary lines the scan located (a finished adaptive map); drawn instead of the pixel-edge contour. */
  boundaries?: readonly Boundary[] | null;
  width: number;
  height: number;
  title: string;
}

const KEYS = new WeakMap<SolveResult, string>();

/** Category of a state: phase plus fraction, and a coexistence mark (memoised per state). */
export function phaseKey(s: SolveResult | undefined): string | null {
  if (!s) return null;
  let k = KEYS.get(s);
  if (k === undefined) {
    k = `${s.phase}${s.fraction ? ' ' + s.fraction : ''}${s.coexistence ? ' mix' : ''}`;
    KEYS.set(s, k);
  }
  return k;
}

/** The map figure. */
export function phaseMapFigure(o: PhaseMapInput): RenderedFigure {
  const id = 'atlas-map';
  const g = o.grid;
  const hx = halfStep(g.x[0], g.x[1], g.nx), hy = halfStep(g.y[0], g.y[1], g.ny);
  // every cell's state and category once: the marks below look them up many times
  const cells: (SolveResult | undefined)[] = new Array(g.nx * g.ny);
  const keys: (string | null)[] = new Array(g.nx * g.ny);
  for (let j = 0; j < g.ny; j++) for (let i = 0; i < g.nx; i++) {
    const s = o.stateAt(i, j);
    cells[j * g.nx + i] = s;
    keys[j * g.nx + i] = phaseKey(s);
  }
  const at = (i: number, j: number) => cells[j * g.nx + i];
  const key = (i: number, j: number) => keys[j * g.nx + i];
  const present = new Set<PhaseLabel>();
  /** Density-wave fillings on the map, by value (for the shade scale). */
  const fillings = new Map<number, string>();
  let coexistence = false;
  const value = (s: SolveResult) => (o.shade === 'photon' ? s.photonDensity : s.excitationDensity);
  const values: number[] = [];
  for (const s of cells) {
    if (!s) continue;
    present.add(s.phase);
    if (s.phase === 'density-wave' && s.fraction) fillings.set(fractionValue(s.fraction), s.fraction);
    if (s.coexistence) coexistence = true;
    if (o.shade !== 'phase') values.push(value(s));
  }
  const scale = colourScale(values, o.colourRange ?? {}, !!o.log);
  const LEVELS = 24;
  const marks: Mark[] = [];
  if (o.shade === 'phase') {
    const paints = new Map<string, CellPaint>();
    marks.push(heatmap(g, (i, j) => {
      const s = at(i, j);
      if (!s) return null;
      const k = key(i, j) as string;
      let p = paints.get(k);
      if (!p) paints.set(k, p = { key: k, fill: phaseFill(s.phase, s.fraction), texture: phaseTexture(id, s.phase, !!s.coexistence) });
      return p;
    }));
  } else {
    marks.push(heatmap(g, (i, j) => {
      const s = at(i, j);
      if (!s) return null;
      const lev = Math.min(LEVELS - 1, Math.floor(scale.t(value(s)) * LEVELS));
      return { key: String(lev), fill: rampColour((lev + 0.5) / LEVELS) };
    }));
  }
  // the scan's vector boundaries when it returned them, else the edges between unequal pixels
  const vector = o.boundaries ? boundaryLines(o.boundaries) : null;
  marks.push(vector ? vector.mark : categoryContour(g, key, { stroke: INK, width: 1 }));
  // fraction labels where there is room for the text (about 9 px from the region's edge)
  const cellPx = Math.min((o.width - (o.width < 640 ? 70 : 250)) / g.nx, (o.height - 70) / g.ny);
  const minDepth = Math.max(1, Math.ceil(9 / Math.max(cellPx, 1)));
  const labels = regionLabels(g.nx, g.ny, key, (k) => k.startsWith('density-wave') || k.startsWith('supersolid'), minDepth);
  const cx = (i: number) => (g.nx > 1 ? g.x[0] + (i * (g.x[1] - g.x[0])) / (g.nx - 1) : g.x[0]);
  const cy = (j: number) => (g.ny > 1 ? g.y[0] + (j * (g.y[1] - g.y[0])) / (g.ny - 1) : g.y[0]);
  const word = (r: { ix: number; iy: number; key: string }) => {
    const s = at(r.ix, r.iy);
    return o.maxCell !== undefined && s ? regionWord(s, o.maxCell) : r.key.split(' ')[1] ?? '';
  };
  marks.push(textLabels(labels.map((r) => ({ x: cx(r.ix), y: cy(r.iy), text: word(r), size: 12 })), 'fraction-labels'));
  // points whose best pattern used the largest cell searched: may be artefacts of that limit
  const atLimit: { x: number; y: number; r: number; fill: string; stroke: string; strokeWidth: number }[] = [];
  if (o.maxCell !== undefined) {
    for (let j = 0; j < g.ny; j++) for (let i = 0; i < g.nx; i++) {
      const st = at(i, j);
      if (st && atSearchLimit(st, o.maxCell)) atLimit.push({ x: cx(i), y: cy(j), r: 1.6, fill: '#000000', stroke: '#ffffff', strokeWidth: 0.6 });
    }
    if (atLimit.length) marks.push({ ...dots(atLimit), render: (f) => dots(atLimit).render(f).replace('class="dots"', 'class="dots at-limit"') });
  }
  for (const l of o.lines) marks.push(line(l.x, l.y, { stroke: l.stroke, width: 2.2, dash: l.dash, halo: '#ffffff' }));
  if (o.selected) marks.push(dots([{ x: o.selected[0], y: o.selected[1], r: 6, fill: 'none', stroke: '#000000', strokeWidth: 2.5 }]));
  marks.push(axisX({ label: o.xLabel }), axisY({ label: o.yLabel }));
  const entries: LegendEntry[] = o.shade === 'phase' ? phaseLegend(id, present, coexistence) : [];
  const barTitle = o.shade === 'photon' ? 'Photon density \u03b1\u00b2' : 'Excitation density \u03c1';
  const bar = o.shade !== 'phase' && values.length > 0 && o.width >= 640;
  if (bar) {
    marks.push(colourBar({
      title: `${barTitle}${scale.log ? ' (log)' : ''}`, colour: rampColour, levels: LEVELS,
      label: (t) => Number(scale.at(t).toPrecision(3)).toString(), clippedLow: scale.clippedLow, clippedHigh: scale.clippedHigh,
    }));
  } else if (o.shade !== 'phase') {
    // narrow figures: the scale as five swatches below the axis
    for (const t of [0, 0.25, 0.5, 0.75, 1]) {
      const end = (t === 1 && scale.clippedHigh) ? '\u2265 ' : (t === 0 && scale.clippedLow) ? '\u2264 ' : '';
      entries.push({ label: values.length ? end + Number(scale.at(t).toPrecision(3)) : '', swatch: { kind: 'fill', fill: rampColour((Math.min(LEVELS - 1, Math.floor(t * LEVELS)) + 0.5) / LEVELS) } });
    }
  }
  if (vector) entries.push(...vector.legend);
  if (atLimit.length) entries.push({ label: `M = Mmax = ${o.maxCell} (search limit)`, swatch: { kind: 'dot', fill: '#000000', stroke: '#ffffff' } });
  const seen = new Set<string>();
  for (const l of o.lines) {
    if (seen.has(l.label)) continue;
    seen.add(l.label);
    entries.push({ label: `soft: ${l.label}`, swatch: { kind: 'line', stroke: l.stroke, dash: l.dash, width: 2.2 } });
  }
  const narrow = o.width < 640;
  // the density-wave shades' scale: fill against filling, a tick at each filling on the map
  if (o.shade === 'phase' && fillings.size && !narrow) {
    marks.push(colourBar({
      title: 'Density-wave filling', colour: densityWaveColour, levels: 44, height: 140,
      ticks: [0, ...fillings.keys(), 1], label: (t) => fillings.get(t) ?? String(t),
    }));
  }
  marks.push(legend(entries, narrow ? { below: true } : { title: o.shade === 'phase' ? 'Phase' : undefined }));
  const extra = narrow ? legendBelowHeight(entries.length, o.width) : 0;
  const { svg, frame } = renderFigure({
    id, width: o.width, height: o.height + extra, margin: narrow ? { right: 12, bottom: 48 + extra } : { right: 150 },
    x: [g.x[0] - hx, g.x[1] + hx], y: [g.y[0] - hy, g.y[1] + hy],
    marks, defs: textureDefs, title: o.title,
  });
  return { svg, frame, name: 'phase-map', title: o.title };
}
