/**
 * Fluctuation spectra and soft-mode lines (issue 3).
 *  1. Time of the branches of a 12-sublattice state (a stationary supersolid of the vdw
 *     chain, Rb = 1.5, delta = 1, mu = 0.6, in the 12-site cell) on 256 path points.
 *  2. A soft-mode line traced (src/core/softmode/zero-line-trace.ts) against the same line
 *     read off a dense grid of margins by marching squares (linear interpolation on cell
 *     edges), as a ratio of margin evaluations at equal accuracy. Accuracy is the Hausdorff
 *     distance, in units of the axis spans, to a reference trace at tol 1e-6 (its own error
 *     ~1e-6). Dense grids of N = 9, 17, 33, 65, 129 nodes a side are subsampled from one
 *     129 x 129 grid; the N as accurate as the trace, interpolated between the two grids
 *     that bracket its accuracy by their local convergence order (extrapolated beyond the
 *     finest, and the figure says so), sets the dense cost N^2. Two planes: the uniform condensate's density-wave line in
 *     (mu, rb) and the normal state's superradiant line in (mu, T), both vdw chains (the
 *     second window stops short of mu = -0.37, T = 0.24, where a density-wave line of the
 *     normal state meets the superradiant one at a corner: there both methods are limited
 *     to a few grid steps or tol, and a smooth line is the fair comparison).
 *     --quick uses N <= 65.
 */
import { solveInCell } from '../src/core/meanfield/cell-search.ts';
import { background } from '../src/core/spectrum/background.ts';
import { fluctuationSpectrum } from '../src/core/spectrum/spectrum.ts';
import { marginAt } from '../src/core/softmode/soft-lines.ts';
import { planePoint, type PlaneAxis } from '../src/core/softmode/plane.ts';
import type { FollowedPhase, PointModel } from '../src/core/softmode/own-solution.ts';
import { traceZeroLines } from '../src/core/softmode/zero-line-trace.ts';
import type { Bench, BenchContext } from './harness.ts';

type P2 = [number, number];
type Seg = [P2, P2];

function branchesTiming(ctx: BenchContext): void {
  const p = { lattice: 'chain' as const, interaction: { shape: 'vdw' as const, Rb: 1.5 }, delta: 1, mu: 0.6, T: 0, maxCell: 12 };
  const c = solveInCell(p, { a: 12, b: 0, c: 1 });
  if (!c) throw new Error('no 12-sublattice solution');
  const bg = background({ lattice: 'chain', interaction: p.interaction, cell: { a: 12, b: 0, c: 1 }, densities: Array.from(c.sol.m), alpha: c.sol.alpha, mu: p.mu, delta: p.delta, T: 0 });
  fluctuationSpectrum(bg, { points: 16 }); // warm the JIT
  let best = Infinity, branches = 0;
  for (let r = 0; r < 3; r++) {
    const t0 = performance.now();
    const sp = fluctuationSpectrum(bg, { points: 256 });
    best = Math.min(best, (performance.now() - t0) / 1000);
    branches = sp.branches[1].omega.length;
  }
  ctx.log(`state: alpha = ${c.sol.alpha.toFixed(4)}, ${branches} branches at k != 0, residual ${bg.residual.emitter.toExponential(1)}`);
  ctx.figure('branches, 12 sublattices, 256 k points', best, 's', { note: 'best of 3, one thread' });
}

/** Marching squares: the zero segments of a grid of values (null cells skipped). */
function marchingSquares(f: (number | null)[], N: number): Seg[] {
  const out: Seg[] = [];
  const at = (i: number, j: number) => f[j * N + i];
  const h = 1 / (N - 1);
  for (let j = 0; j + 1 < N; j++) for (let i = 0; i + 1 < N; i++) {
    const c = [[i, j], [i + 1, j], [i + 1, j + 1], [i, j + 1]] as const;
    const v = c.map(([a, b]) => at(a, b));
    if (v.some((x) => x === null)) continue;
    const pts: P2[] = [];
    for (let e = 0; e < 4; e++) {
      const a = v[e] as number, b = v[(e + 1) % 4] as number;
      if ((a >= 0) === (b >= 0)) continue;
      const t = a / (a - b), [p, q] = [c[e], c[(e + 1) % 4]];
      pts.push([(p[0] + t * (q[0] - p[0])) * h, (p[1] + t * (q[1] - p[1])) * h]);
    }
    for (let k = 0; k + 1 < pts.length; k += 2) out.push([pts[k], pts[k + 1]]);
  }
  return out;
}

function toSeg(x: P2, [p, q]: Seg): number {
  const ux = q[0] - p[0], uy = q[1] - p[1], L2 = ux * ux + uy * uy;
  const t = L2 > 0 ? Math.max(0, Math.min(1, ((x[0] - p[0]) * ux + (x[1] - p[1]) * uy) / L2)) : 0;
  return Math.hypot(x[0] - p[0] - t * ux, x[1] - p[1] - t * uy);
}

/** Hausdorff distance between two segment sets, each sampled at ends and midpoints. */
function hausdorff(a: Seg[], b: Seg[]): number {
  const one = (s: Seg[], t: Seg[]) => {
    let d = 0;
    for (const [p, q] of s) for (const x of [p, q, [(p[0] + q[0]) / 2, (p[1] + q[1]) / 2] as P2]) {
      let m = Infinity;
      for (const g of t) m = Math.min(m, toSeg(x, g));
      d = Math.max(d, m);
    }
    return d;
  };
  return Math.max(one(a, b), one(b, a));
}

/**
 * The dense grid as accurate as `acc`: between the two measured grids that bracket it, by
 * the local order acc ~ (N - 1)^-p; beyond the finest, extrapolated with the finest pair's order.
 */
function denseEquivalent(dense: { N: number; acc: number }[], acc: number): { N: number; note: string } {
  let i = dense.findIndex((d) => d.acc <= acc);
  if (i === 0) return { N: dense[0].N, note: `the coarsest grid (${dense[0].N} x ${dense[0].N}) is already as accurate` };
  const extrapolated = i < 0;
  if (extrapolated) i = dense.length - 1;
  const [a, b] = [dense[i - 1], dense[i]];
  const order = Math.log(a.acc / b.acc) / Math.log((b.N - 1) / (a.N - 1));
  const N = 1 + (a.N - 1) * Math.pow(a.acc / acc, 1 / order);
  return { N, note: `dense N = ${N.toFixed(0)} ${extrapolated ? 'extrapolated' : 'interpolated'} between N = ${a.N} and ${b.N} (local order ${order.toFixed(2)})` };
}

const segsOf = (lines: { points: { u: number; v: number }[]; closed: boolean }[]): Seg[] =>
  lines.flatMap((L) => L.points.slice(1).map((p, i): Seg => [[L.points[i].u, L.points[i].v], [p.u, p.v]]));

function plane(ctx: BenchContext, label: string, base: PointModel, x: PlaneAxis, y: PlaneAxis, phase: FollowedPhase, quick: boolean): void {
  const f = (u: number, v: number) => {
    const m = marginAt(phase, planePoint(base, 'vdw', x, x.start + u * (x.stop - x.start), y, y.start + v * (y.stop - y.start)));
    return { value: m.value, payload: null };
  };
  const ref = traceZeroLines(f, { seed: 9, tol: 1e-6 });
  const refSegs = segsOf(ref.lines);
  const Nmax = quick ? 65 : 129;
  const grid: (number | null)[] = [];
  for (let j = 0; j < Nmax; j++) for (let i = 0; i < Nmax; i++) grid.push(f(i / (Nmax - 1), j / (Nmax - 1)).value);
  const dense: { N: number; acc: number }[] = [];
  for (let N = 9; N <= Nmax; N = 2 * N - 1) {
    const d = (Nmax - 1) / (N - 1), sub: (number | null)[] = [];
    for (let j = 0; j < N; j++) for (let i = 0; i < N; i++) sub.push(grid[j * d * Nmax + i * d]);
    dense.push({ N, acc: hausdorff(marchingSquares(sub, N), refSegs) });
  }
  ctx.log(`${label}: reference ${ref.lines.length} line(s), ${ref.evaluations} evaluations; dense accuracy ` +
    dense.map((d) => `N=${d.N}: ${d.acc.toExponential(1)}`).join(', '));
  for (const tol of [1e-3, 1e-4]) {
    const tr = traceZeroLines(f, { seed: 9, tol });
    const acc = hausdorff(segsOf(tr.lines), refSegs);
    const { N, note } = denseEquivalent(dense, acc);
    ctx.figure(`${label}, tol ${tol}: traced/dense evaluations`, tr.evaluations / (N * N), 'ratio',
      { target: tol === 1e-4 ? '<= 0.1' : undefined, note: `${tr.evaluations} traced (accuracy ${acc.toExponential(1)}); ${note}` });
  }
}

const bench: Bench = {
  name: 'spectrum',
  title: 'fluctuation branches of a 12-sublattice state; a soft-mode line traced against a dense grid of margins',
  async run(ctx) {
    branchesTiming(ctx);
    const quick = ctx.flag('quick');
    plane(ctx, 'condensate DW line (mu, rb)', { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1 }, mu: 0, delta: 1, T: 0 },
      { name: 'mu', start: -1, stop: 0.9, count: 9 }, { name: 'rb', start: 0.8, stop: 1.5, count: 9 }, 'condensate', quick);
    plane(ctx, 'normal SR line (mu, T)', { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1 }, mu: 0, delta: 1, T: 0 },
      { name: 'mu', start: -1.2, stop: -0.4, count: 9 }, { name: 'temperature', start: 0, stop: 0.4, count: 9 }, 'normal', quick);
  },
};

export default bench;
