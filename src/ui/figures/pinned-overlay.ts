/**
 * A pinned result drawn over the current figure, for comparing two parameter sets: the
 * pinned map's phase boundaries as dashed lines over the new map (the boundary lines its
 * scan located, or the edges between its unequal cells while it had none), and the
 * pinned staircase's rho(mu) and filling over the new one. Each with a legend entry that
 * names the pinned parameters. Appended to the figure's SVG, so exports carry it.
 */
import type { Frame } from '../plot/frame.ts';
import { polylines } from '../plot/polyline-mark.ts';
import { categoryContour } from '../plot/contour.ts';
import { line } from '../plot/line.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import type { PinnedMap, PinnedStaircase } from '../state/pinned-results.ts';
import { appendToFigure, overlayLegend, wrapText } from './lab-point-mark.ts';

/** The pinned result's colour: a dark violet, apart from the phase fills and the black boundaries. */
export const PINNED_STROKE = '#6a1b9a';
const DASH = '7 4';

/** A number per pinned object, so a new pin with the same label is never served a memoised old drawing. */
const ids = new WeakMap<object, number>();
let nextId = 1;
const idOf = (o: object) => ids.get(o) ?? (ids.set(o, nextId), nextId++);

const lineChars = (f: Frame) => Math.max(18, Math.floor((f.margin.right >= 150 ? f.margin.right - 30 : 200) / 6.3));

/** The pinned map's boundaries in the figure's frame. */
function mapLines(f: Frame, p: PinnedMap): string {
  if (p.boundaries) {
    return polylines(p.boundaries.map((b) => ({ points: b.points, style: { stroke: PINNED_STROKE, width: 1.8, dash: DASH, halo: '#ffffff' } })), 'pinned-boundaries').render(f);
  }
  const key = (i: number, j: number) => p.keys[j * p.grid.nx + i];
  return `<g class="polylines pinned-boundaries">${categoryContour(p.grid, key, { stroke: PINNED_STROKE, width: 1.8, dash: DASH }).render(f)}</g>`;
}

/**
 * The map with the pinned map's boundaries over it, or with only a legend note (and
 * `drawn` false) when the pinned map is over other axes than `axes`. `rows`: the legend
 * rows taken, the slot of the next overlay.
 */
export function withPinnedMap(fig: RenderedFigure, p: PinnedMap, axes: { x: string; y: string }, slot = 0): { fig: RenderedFigure; drawn: boolean; rows: number } {
  const f = fig.frame;
  const same = p.xName === axes.x && p.yName === axes.y;
  const lines = same ? ['pinned map (dashed):', ...wrapText(p.label, lineChars(f))]
    : ['pinned map is over other axes:', `${p.xName} \u00d7 ${p.yName}; not drawn`];
  const legend = `<g class="pinned-legend">${overlayLegend(f, [{ swatch: 'dashed', stroke: PINNED_STROKE, lines }], slot)}</g>`;
  return { fig: appendToFigure(fig, `pin-map|${idOf(p)}|${slot}|${same}`, same ? mapLines(f, p) : '', legend,
    (base) => withPinnedMap(base, p, axes, slot).fig), drawn: same, rows: lines.length };
}

/** The staircase with the pinned staircase's curves over it (rho dashed, filling dotted, in the pinned colour), and the legend rows taken. */
export function withPinnedStaircase(fig: RenderedFigure, p: PinnedStaircase, slot = 0): { fig: RenderedFigure; rows: number } {
  const f = fig.frame;
  let drawn = '';
  for (const s of p.series) {
    drawn += line(s.mu, s.rho, { stroke: PINNED_STROKE, width: 2, dash: DASH }).render(f);
    drawn += line(s.mu, s.filling, { stroke: PINNED_STROKE, width: 1.2, dash: '1 3' }).render(f);
  }
  const ranges = p.series.map((s) => s.label).join(' and ');
  const lines = ['pinned staircase:', ...wrapText(`\u03c1 dashed, \u27e8n\u27e9 dotted; ${ranges}; ${p.label}`, lineChars(f))];
  const legend = `<g class="pinned-legend">${overlayLegend(f, [{ swatch: 'dashed', stroke: PINNED_STROKE, lines }], slot)}</g>`;
  return { fig: appendToFigure(fig, `pin-st|${idOf(p)}|${slot}`, `<g class="pinned-staircase">${drawn}</g>`, legend,
    (base) => withPinnedStaircase(base, p, slot).fig), rows: lines.length };
}
