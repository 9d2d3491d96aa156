/**
 * Fluctuation branches omega_n(k) along the zone path (a line per branch, the extra
 * photon branch at the zone centre as dots), and the stability margin against k with the
 * softest wavevector k* marked. High-symmetry corners label the horizontal axis.
 *
 * Nothing is hidden: branches that coincide along the whole path (flat bands of equal
 * sublattices) are drawn dashed over each other and named together in the legend, and
 * whatever lies outside the chosen frequency range is counted in a note at the top. By
 * default the range follows the low branches (lowBranches: from the lowest up, a branch
 * joins while its minimum lies below GAP_FACTOR times the top so far plus 0.5 g, so a
 * branch far above, such as a flat band of excited sites at ~V1, does not squash the
 * others); "all" takes every branch and the photon-like dots; a [lo, hi] pair zooms to it. Narrow figures (under
 * NARROW px) put the legend under the axis so the plot keeps its width and its axes.
 */
import type { StateSpectrum } from '../../core/spectrum/state-spectrum.ts';
import { renderFigure } from '../plot/figure.ts';
import { line } from '../plot/line.ts';
import { dots } from '../plot/dot.ts';
import { bandsX, type Band } from '../plot/band.ts';
import { ruleX, ruleY } from '../plot/rule.ts';
import { axisX, axisY } from '../plot/axis.ts';
import { legend, legendBelowHeight, type LegendEntry } from '../plot/legend.ts';
import { SERIES } from '../plot/house-style.ts';
import type { Frame, Mark } from '../plot/frame.ts';
import { el, esc } from '../plot/svg-markup.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import { kText } from '../model/pi-multiple.ts';

/** Branch colours: the house series palette (colour-blind safe, tests/ui/plot/palette-vision.test.ts). */
const BRANCH = SERIES;

/** A branch joins the low range while its minimum is below GAP_FACTOR x (top so far) + 0.5 g. */
export const GAP_FACTOR = 3;

/** The low branches: branch 1, then each next branch (by minimum) that starts near the range so far. */
export function lowBranches(lines: number[][]): number[][] {
  const fin = (l: number[]) => l.filter(Number.isFinite);
  const order = lines.filter((l) => fin(l).length).sort((a, b) => Math.min(...fin(a)) - Math.min(...fin(b)));
  const out: number[][] = [];
  let top = -Infinity;
  for (const l of order) {
    const lo = Math.min(...fin(l));
    if (out.length && lo > GAP_FACTOR * Math.max(top, 0) + 0.5) break;
    out.push(l);
    top = Math.max(top, ...fin(l));
  }
  return out;
}
/** Figures narrower than this (px) take their legend below the axis. */
export const NARROW = 560;
/** Two branches coincide when they differ by less than this (g) at every path point. */
const SAME = 1e-9;

/** Frequency range of the branch figure: the low branches, all of them, or [lo, hi] in g. */
export type BranchRange = 'low' | 'all' | [number, number];

/** Corner labels as symbols. */
export function cornerLabel(l: string): string {
  return l === 'Gamma' ? '\u0393' : l === 'pi' ? '\u03c0' : l;
}

/** |k*| on the path of a 1D spectrum (the path is 0..pi, s = k), else null. */
export function softPathPosition(sp: StateSpectrum): number | null {
  const k = sp.softMode.k;
  return typeof k === 'number' ? Math.abs(k) : null;
}

/** Groups of branch indices that coincide at every path point (each group ascending). */
export function coincidentBranches(lines: number[][]): number[][] {
  const groups: number[][] = [];
  const taken = new Set<number>();
  for (let n = 0; n < lines.length; n++) {
    if (taken.has(n)) continue;
    const g = [n];
    for (let m = n + 1; m < lines.length; m++) {
      if (!taken.has(m) && lines[n].every((w, i) => Math.abs(w - lines[m][i]) < SAME)) { g.push(m); taken.add(m); }
    }
    groups.push(g);
  }
  return groups;
}

/** A note in the top margin, over the plot area's left edge (what the range leaves out). */
function topNote(text: string): Mark {
  return {
    clip: false,
    render(f: Frame) {
      return el('text', { class: 'range-note', x: f.inner.x0, y: f.inner.y0 - 6, 'font-size': 10.5, fill: '#7a1f1f' }, esc(text));
    },
  };
}

const f4 = (x: number) => Number(x.toPrecision(4)).toString();

export function branchesFigure(sp: StateSpectrum, width: number, height: number, title: string, range: BranchRange = 'low'): RenderedFigure {
  const s = sp.branches.map((b) => b.s);
  const common = Math.min(...sp.branches.map((b) => b.omega.length));
  // At the zone centre the photon adds a branch: take out the one with the largest photon
  // weight there (zoneCentre), so the emitter branches run on continuously through k = 0.
  const zc = sp.zoneCentre;
  const photonOmega = zc.omega.length ? zc.omega[zc.photonWeight.indexOf(Math.max(...zc.photonWeight))] : NaN;
  const omegas = sp.branches.map((b) => {
    if (b.omega.length <= common) return { line: b.omega, extra: [] as number[] };
    let j = 0;
    b.omega.forEach((w, i) => { if (Math.abs(w - photonOmega) < Math.abs(b.omega[j] - photonOmega)) j = i; });
    return { line: b.omega.filter((_, i) => i !== j), extra: [b.omega[j]] };
  });
  const lines = Array.from({ length: common }, (_, n) => omegas.map((o) => o.line[n]));
  const extra = sp.branches.flatMap((b, i) => omegas[i].extra.map((w) => ({ x: b.s, y: w })));
  // the frequency range: zoomed, every branch, or the lowest LOW_BRANCHES (branches are ordered by frequency)
  const span = (vals: number[]): [number, number] => {
    const v = [0, ...vals.filter(Number.isFinite)];
    const lo = Math.min(...v), hi = Math.max(...v), pad = (hi - lo) * 0.06 || 0.5;
    return [lo - pad, hi + pad];
  };
  const y: [number, number] = Array.isArray(range) ? [range[0], range[1]]
    // (the photon-like modes at k = 0 take part in the low range as one-point branches)
    : span(range === 'all' ? [...lines.flat(), ...extra.map((p) => p.y)] : lowBranches([...lines, ...extra.map((p) => [p.y])]).flat());
  const inRange = (w: number) => w >= y[0] && w <= y[1];
  const marks: Mark[] = [];
  const entries: LegendEntry[] = [];
  const groups = coincidentBranches(lines);
  groups.forEach((g, gi) => {
    g.forEach((n, j) => {
      const c = BRANCH[n % BRANCH.length];
      // coincident branches: the later ones dashed over the first, so each colour shows
      marks.push(line(s, lines[n], { stroke: c, width: 1.8, dash: j === 0 ? undefined : `${4 + 2 * j} ${4 + 2 * j}` }));
    });
    const c = BRANCH[g[0] % BRANCH.length];
    const name = g.length === 1 ? `branch ${g[0] + 1}` : `branches ${g.map((n) => n + 1).join(' = ')} (${g.length}-fold)`;
    if (gi < 8) entries.push({ label: name, swatch: { kind: 'line', stroke: c, width: 1.8, dash: g.length > 1 ? '6 6' : undefined } });
  });
  if (groups.length > 8) entries.push({ label: `and ${groups.length - 8} more (${common} in all)`, swatch: { kind: 'line', stroke: '#7d8798' } });
  if (extra.length) {
    marks.push(dots(extra.map((p) => ({ ...p, r: 4, fill: '#ecab13', stroke: '#1f2430' }))));
    entries.push({ label: 'photon-like (k = 0)', swatch: { kind: 'dot', fill: '#ecab13' } });
  }
  // what the range leaves out, said on the figure
  const above = lines.filter((l) => l.every((w) => !Number.isFinite(w) || w > y[1])).length;
  const partly = lines.filter((l) => l.some((w) => Number.isFinite(w) && !inRange(w))).length - above;
  const dotsOut = extra.filter((p) => !inRange(p.y)).length;
  const top = Math.max(...lines.flat().filter(Number.isFinite), ...extra.map((p) => p.y));
  const out: string[] = [];
  if (above) out.push(`${above} branch${above === 1 ? '' : 'es'}`);
  if (partly) out.push(`${partly} in part`);
  if (dotsOut) out.push('photon mode');
  if (out.length) marks.push(topNote(`outside the range: ${out.join(', ')} (up to \u03c9 = ${f4(top)} g)`));
  // runs of path points with complex eigenvalues, shaded (half a step either side)
  const bands: Band[] = [];
  const h = s.length > 1 ? (s[1] - s[0]) / 2 : 0;
  sp.branches.forEach((b, i) => {
    if (!(b.growth > 0)) return;
    const last = bands[bands.length - 1];
    if (last && i > 0 && sp.branches[i - 1].growth > 0) last.x1 = b.s + h;
    else bands.push({ x0: b.s - h, x1: b.s + h, fill: '#c0392b', opacity: 0.18 });
  });
  if (bands.length) {
    marks.unshift(bandsX(bands));
    entries.push({ label: 'complex \u03c9 (unstable)', swatch: { kind: 'fill', fill: 'rgba(192,57,43,0.18)' } });
  }
  for (const t of sp.ticks) marks.push(ruleX(t.s, { stroke: '#c9cfd9', width: 1 }));
  marks.push(ruleY(0, { stroke: '#7d8798', dash: '2 2' }));
  marks.push(axisX({ label: 'wavevector along the path (1/a)', tickValues: sp.ticks.map((t) => ({ value: t.s, label: cornerLabel(t.label) })) }));
  const narrow = width < NARROW;
  // the axis title fits the plot's height: short on narrow figures
  marks.push(axisY({ label: narrow ? 'frequency \u03c9 (g)' : 'frequency \u03c9 (g), frame rotating at \u03bc', grid: true }));
  marks.push(legend(entries, narrow ? { below: true } : { title: 'Branches' }));
  const below = narrow ? legendBelowHeight(entries.length, width) : 0;
  const { svg, frame } = renderFigure({
    id: 'branches', width, height: height + below,
    margin: narrow ? { top: 22, right: 14, left: 62, bottom: 46 + below } : { top: 22, right: 24, left: 62 },
    x: [s[0], s[s.length - 1]], y, marks, title,
  });
  return { svg, frame, name: 'branches', title };
}

export function marginFigure(sp: StateSpectrum, width: number, height: number): RenderedFigure {
  const s = sp.branches.map((b) => b.s);
  const kStar = softPathPosition(sp);
  const marks: Mark[] = [
    ruleY(0, { stroke: '#8a2b0f', dash: '4 3', label: 'instability' }),
    line(s, sp.margins, { stroke: SERIES[0], width: 2 }),
  ];
  const entries: LegendEntry[] = [
    { label: 'margin(k)', swatch: { kind: 'line', stroke: SERIES[0], width: 2 } },
    { label: 'margin 0: soft', swatch: { kind: 'line', stroke: '#8a2b0f', dash: '4 3' } },
  ];
  if (kStar !== null) {
    marks.push(ruleX(kStar, { stroke: SERIES[1], width: 1.5, label: 'k*' }));
    entries.push({ label: `k* = ${kText(kStar, 4)} (${sp.softMode.kind})`, swatch: { kind: 'line', stroke: SERIES[1], width: 1.5 } });
  }
  for (const t of sp.ticks) marks.push(ruleX(t.s, { stroke: '#c9cfd9' }));
  marks.push(axisX({ label: 'wavevector along the path (1/a)', tickValues: sp.ticks.map((t) => ({ value: t.s, label: cornerLabel(t.label) })) }));
  const narrow = width < NARROW;
  marks.push(axisY({ label: narrow ? 'stability margin' : 'stability margin (dimensionless)', grid: true }), legend(entries, narrow ? { below: true } : { title: 'Static stability' }));
  const below = narrow ? legendBelowHeight(entries.length, width) : 0;
  const ys = [...sp.margins, 0, sp.softMode.margin].filter(Number.isFinite);
  const lo = Math.min(...ys), hi = Math.max(...ys), pad = (hi - lo) * 0.08 || 0.1;
  const title = `Stability margin against k; softest mode margin ${sp.softMode.margin.toPrecision(4)}`;
  const { svg, frame } = renderFigure({
    id: 'margin', width, height: height + below, margin: narrow ? { right: 14, left: 62, bottom: 46 + below } : { right: 24, left: 62 },
    x: [s[0], s[s.length - 1]], y: [lo - pad, hi + pad], marks, title,
  });
  return { svg, frame, name: 'stability-margin', title };
}
