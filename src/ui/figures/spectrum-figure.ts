/**
 * Fluctuation branches omega_n(k) along the zone path (a line per branch, the extra
 * photon branch at the zone centre as dots), and the stability margin against k with the
 * softest wavevector k* marked. High-symmetry corners label the horizontal axis.
 */
import type { StateSpectrum } from '../../core/spectrum/state-spectrum.ts';
import { renderFigure } from '../plot/figure.ts';
import { line } from '../plot/line.ts';
import { dots } from '../plot/dot.ts';
import { bandsX, type Band } from '../plot/band.ts';
import { ruleX, ruleY } from '../plot/rule.ts';
import { axisX, axisY } from '../plot/axis.ts';
import { legend, type LegendEntry } from '../plot/legend.ts';
import type { Mark } from '../plot/frame.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';

const BRANCH = ['#165a78', '#b3124e', '#0c6e4f', '#5a2ca0', '#8a4b00', '#1d2430'];

/** Corner labels as symbols. */
export function cornerLabel(l: string): string {
  return l === 'Gamma' ? '\u0393' : l === 'pi' ? '\u03c0' : l;
}

/** |k*| on the path of a 1D spectrum (the path is 0..pi, s = k), else null. */
export function softPathPosition(sp: StateSpectrum): number | null {
  const k = sp.softMode.k;
  return typeof k === 'number' ? Math.abs(k) : null;
}

export function branchesFigure(sp: StateSpectrum, width: number, height: number, title: string): RenderedFigure {
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
  const marks: Mark[] = [];
  const entries: LegendEntry[] = [];
  const ys: number[] = [0];
  for (let n = 0; n < common; n++) {
    const y = omegas.map((o) => o.line[n]);
    ys.push(...y);
    const c = BRANCH[n % BRANCH.length];
    marks.push(line(s, y, { stroke: c, width: 1.8 }));
    if (n < 5) entries.push({ label: `branch ${n + 1}`, swatch: { kind: 'line', stroke: c, width: 1.8 } });
  }
  if (common > 5) entries.push({ label: `\u2026 ${common} branches`, swatch: { kind: 'line', stroke: '#7d8798' } });
  const extra = sp.branches.flatMap((b, i) => omegas[i].extra.map((w) => ({ x: b.s, y: w })));
  if (extra.length) {
    ys.push(...extra.map((p) => p.y));
    marks.push(dots(extra.map((p) => ({ ...p, r: 4, fill: '#c46a00', stroke: '#1d2430' }))));
    entries.push({ label: 'photon-like (k = 0)', swatch: { kind: 'dot', fill: '#c46a00' } });
  }
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
  marks.push(axisY({ label: 'frequency \u03c9 (g), frame rotating at \u03bc', grid: true }));
  marks.push(legend(entries, { title: 'Branches' }));
  const lo = Math.min(...ys), hi = Math.max(...ys), pad = (hi - lo) * 0.06 || 0.5;
  const { svg, frame } = renderFigure({
    id: 'branches', width, height, margin: { right: 200, left: 62 }, x: [s[0], s[s.length - 1]], y: [lo - pad, hi + pad], marks, title,
  });
  return { svg, frame, name: 'branches', title };
}

export function marginFigure(sp: StateSpectrum, width: number, height: number): RenderedFigure {
  const s = sp.branches.map((b) => b.s);
  const kStar = softPathPosition(sp);
  const marks: Mark[] = [
    ruleY(0, { stroke: '#8a2b0f', dash: '4 3', label: 'instability' }),
    line(s, sp.margins, { stroke: '#165a78', width: 2 }),
  ];
  const entries: LegendEntry[] = [
    { label: 'margin(k)', swatch: { kind: 'line', stroke: '#165a78', width: 2 } },
    { label: 'margin 0: soft', swatch: { kind: 'line', stroke: '#8a2b0f', dash: '4 3' } },
  ];
  if (kStar !== null) {
    marks.push(ruleX(kStar, { stroke: '#c46a00', width: 1.5, label: 'k*' }));
    entries.push({ label: `k* = ${kStar.toFixed(4)} (${sp.softMode.kind})`, swatch: { kind: 'line', stroke: '#c46a00', width: 1.5 } });
  }
  for (const t of sp.ticks) marks.push(ruleX(t.s, { stroke: '#c9cfd9' }));
  marks.push(axisX({ label: 'wavevector along the path (1/a)', tickValues: sp.ticks.map((t) => ({ value: t.s, label: cornerLabel(t.label) })) }));
  marks.push(axisY({ label: 'stability margin (dimensionless)', grid: true }), legend(entries, { title: 'Static stability' }));
  const ys = [...sp.margins, 0, sp.softMode.margin].filter(Number.isFinite);
  const lo = Math.min(...ys), hi = Math.max(...ys), pad = (hi - lo) * 0.08 || 0.1;
  const title = `Stability margin against k; softest mode margin ${sp.softMode.margin.toPrecision(4)}`;
  const { svg, frame } = renderFigure({
    id: 'margin', width, height, margin: { right: 200, left: 62 }, x: [s[0], s[s.length - 1]], y: [lo - pad, hi + pad], marks, title,
  });
  return { svg, frame, name: 'stability-margin', title };
}
