/**
 * The sublattice pattern of a mean-field state drawn on the lattice, to scale: every site
 * of a window of the lattice shaded by its sublattice's density m_s (white = empty, ink =
 * filled), ringed in amber with a width growing with its coherence |<sigma^x>_s| (the
 * emitter's share of the photon condensate), and the supercell outlined. The density
 * legend is a continuous bar under the x axis (m from 0 to 1, the same grey ramp as the
 * sites), where m is the probability that a site's emitter is excited, <n> of its sublattice.
 */
import type { MeanFieldState } from '../../core/meanfield/state.ts';
import { type LatticeName, lattice, position } from '../../core/lattice/geometry.ts';
import { supercell, sublatticeOf, superlatticeVectors } from '../../core/lattice/supercells.ts';
import { renderFigure } from '../plot/figure.ts';
import { dots, type Dot } from '../plot/dot.ts';
import { line } from '../plot/line.ts';
import { axisX, axisY } from '../plot/axis.ts';
import { legend } from '../plot/legend.ts';
import { SERIES } from '../plot/house-style.ts';
import type { Frame, Mark } from '../plot/frame.ts';
import { el } from '../plot/svg-markup.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';

const COHERENCE = SERIES[1];

/** Grey of density m: lightness 100% at m = 0 to 14% at m = 1. */
export function densityGrey(m: number): string {
  const x = Math.min(1, Math.max(0, m));
  return `hsl(215 12% ${Math.round(100 - 86 * x)}%)`;
}

/** Bottom margin (px) that holds the x axis and, under it, the density bar with its tick labels. */
const BAR_BOTTOM = 84;

/** The gradient of densityGrey over m in [0, 1] (21 stops: the ramp is linear in lightness, piecewise in RGB). */
function densityGradient(id: string): string {
  const stops = Array.from({ length: 21 }, (_, i) => el('stop', { offset: `${i * 5}%`, 'stop-color': densityGrey(i / 20) })).join('');
  return `<linearGradient id="${id}" x1="0" x2="1" y1="0" y2="0">${stops}</linearGradient>`;
}

/** A horizontal bar of m from 0 to 1 under the x axis (left-aligned with the plot), with ticks at 0, 0.5 and 1. */
function densityBar(id: string): Mark {
  return {
    clip: false,
    render(f: Frame) {
      const y = f.inner.y1 + 48, x = f.inner.x0 + 118, w = 140, h = 11;
      let out = el('text', { x: f.inner.x0, y: y + 10, 'font-size': 11.5, fill: '#1d2430' }, 'site density m = \u27e8n\u27e9');
      out += el('rect', { x, y, width: w, height: h, fill: `url(#${id})`, stroke: '#5b6577', 'stroke-width': 0.8 });
      for (const [t, label] of [[0, '0 empty'], [0.5, '0.5'], [1, '1 excited']] as const) {
        const X = x + t * w;
        out += el('line', { x1: X, x2: X, y1: y + h, y2: y + h + 4, stroke: '#1d2430' });
        out += el('text', { x: X, y: y + h + 15, 'text-anchor': t === 0 ? 'start' : t === 1 ? 'end' : 'middle', 'font-size': 10.5, fill: '#1d2430' }, label);
      }
      return `<g class="density-bar">${out}</g>`;
    },
  };
}

/** Sites (x, y, sublattice) of a window holding a few supercells. */
export function patternSites(name: LatticeName, cell: { a: number; b: number; c: number }, maxSites = 64) {
  const l = lattice(name);
  const sc = supercell(cell.a, cell.b, cell.c);
  const out: { x: number; y: number; s: number }[] = [];
  if (l.dim === 1) {
    const n = Math.max(12, Math.min(3 * sc.M, 48));
    for (let i = 0; i < n; i++) out.push({ x: i, y: 0, s: sublatticeOf(sc, i, 0) });
  } else {
    const side = Math.max(4, Math.min(Math.ceil(Math.sqrt(maxSites)), 2 * Math.max(sc.a, sc.c) + 2));
    for (let j = 0; j < side; j++) for (let i = 0; i < side; i++) {
      const ii = name === 'triangular' ? i - Math.floor(j / 2) : i; // a rectangular-looking window
      const [x, y] = position(l, ii, j);
      out.push({ x, y, s: sublatticeOf(sc, ii, j) });
    }
  }
  return { sites: out, sc, l };
}

/** The pattern figure of a state on lattice `name`. */
export function patternFigure(name: LatticeName, st: MeanFieldState, width: number, height: number): RenderedFigure {
  const { sites, sc, l } = patternSites(name, st.cell);
  const xs = sites.map((p) => p.x), ys = sites.map((p) => p.y);
  const x0 = Math.min(...xs) - 0.7, x1 = Math.max(...xs) + 0.7;
  const y0 = Math.min(...ys) - (l.dim === 1 ? 1.2 : 0.7), y1 = Math.max(...ys) + (l.dim === 1 ? 1.2 : 0.7);
  const frameW = width - 76, frameH = height - 100;
  const pxPerA = Math.min(frameW / (x1 - x0), frameH / (y1 - y0));
  const r = Math.max(3, Math.min(14, pxPerA * 0.36));
  const cmax = Math.max(1e-12, ...st.sublatticeCoherences.map(Math.abs));
  const list: Dot[] = sites.map((p) => {
    const m = st.sublatticeDensities[p.s] ?? 0, sx = st.sublatticeCoherences[p.s] ?? 0;
    const coh = Math.abs(sx);
    return {
      x: p.x, y: p.y, r, fill: densityGrey(m), stroke: coh > 1e-6 ? COHERENCE : '#5b6577',
      strokeWidth: coh > 1e-6 ? 1 + 4 * (coh / Math.max(cmax, 0.05)) * Math.min(1, cmax / 0.5) : 0.8,
      title: `sublattice ${p.s}: m = ${m.toFixed(4)}, <\u03c3x> = ${sx.toFixed(4)}`,
    };
  });
  // the supercell at the origin, outlined
  const [A1, A2] = superlatticeVectors(l, sc);
  // offset by half a primitive cell so the cell's sites sit inside the outline
  const ox = -(l.a1[0] + l.a2[0]) / 2, oy = -(l.a1[1] + l.a2[1]) / 2;
  const cx = l.dim === 1 ? [-0.5, A1[0] - 0.5, A1[0] - 0.5, -0.5, -0.5] : [0, A1[0], A1[0] + A2[0], A2[0], 0].map((v) => v + ox);
  const cy = l.dim === 1 ? [-0.6, -0.6, 0.6, 0.6, -0.6] : [0, A1[1], A1[1] + A2[1], A2[1], 0].map((v) => v + oy);
  const gradientId = 'pattern-density';
  const marks = [
    line(cx, cy, { stroke: SERIES[0], width: 1.5, dash: '5 3' }),
    dots(list),
    axisX({ label: 'x (lattice spacings a)' }),
    axisY({ label: 'y (a)' }),
    densityBar(gradientId),
    legend([
      { label: 'coherence |\u27e8\u03c3x\u27e9|', swatch: { kind: 'dot', fill: '#ffffff', stroke: COHERENCE } },
      { label: `supercell (M = ${st.cellSize})`, swatch: { kind: 'line', stroke: SERIES[0], dash: '5 3' } },
    ]),
  ];
  const title = `Sublattice pattern: ${st.phase}${st.fraction ? ' ' + st.fraction : ''}, M = ${st.cellSize}`;
  const { svg, frame } = renderFigure({
    id: 'pattern', width, height: height + BAR_BOTTOM - 48, margin: { right: 24, left: 52, bottom: BAR_BOTTOM }, x: [x0, x1], y: [y0, y1], equalAspect: true, marks, title,
    defs: () => densityGradient(gradientId),
  });
  return { svg, frame, name: 'sublattice-pattern', title };
}
