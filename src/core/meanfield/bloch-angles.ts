/**
 * T = 0 sublattice mean-field as a minimisation over Bloch angles. A pure product state
 * has on sublattice s the Bloch vector (sin theta_s, 0, -cos theta_s) up to the sign of
 * sigma^x, so m_s = (1 - cos theta_s)/2 and <sigma^x>_s = -sin theta_s; with the photon
 * eliminated (alpha = mean sin theta / (2 (delta - mu)) minimises (delta-mu) alpha^2 +
 * alpha mean <sigma^x>) the energy per site is
 *
 *   Phi(theta) = -mu mean m + (1/(2M)) m.J.m - (mean sin theta)^2 / (4 (delta - mu)),
 *
 *   dPhi/dtheta_s = (1/M) [xi_s sin theta_s / 2 - alpha cos theta_s],
 *   d2Phi/dtheta_s dtheta_t = (1/M) [J_st sin_s sin_t / 4 - cos_s cos_t / (2 M (delta-mu))
 *                              + delta_st (xi_s cos_s / 2 + alpha sin_s)].
 *
 * Its stationary points are the T = 0 mean-field equations (tan theta_s = 2 alpha / xi_s)
 * and Phi = Omega there. Phi is smooth in theta everywhere, unlike the fixed-point map in m
 * (a step function at alpha = 0), so Newton with a Levenberg shift where the Hessian is not
 * positive definite and an Armijo line search converges to a local minimum from any start.
 * An integer pattern is accepted at once when it is a local minimum: every occupied
 * sublattice has xi_s < 0, every empty one xi_s > 0, and mean_s 1/|xi_s| < delta - mu
 * (the Hessian at alpha = 0 is then positive definite: the photon stays uncondensed).
 */
import { choleskySolve } from '../numerics/dense-solve.ts';
import { levenbergFactor, softestDirection } from '../numerics/negative-curvature.ts';
import type { CellProblem, SolveCellOptions } from './cell-problem.ts';
import { hartreeShifts } from './hartree-shift.ts';

/** Converged angles' observables. */
export interface AngleResult {
  m: Float64Array; sx: Float64Array; xi: Float64Array; alpha: number;
  converged: boolean; iterations: number; step: number;
}

/** Offset of the angles from 0 or pi when an unstable integer pattern is the start. */
const KICK = 1e-3;
/** Largest change of any angle in one step (radians). */
const MAX_TURN = 1;

function hartree(p: CellProblem, m: ArrayLike<number>, xi: Float64Array): void {
  hartreeShifts(p.J, p.M, p.mu, m, xi);
}

/** Whether the integer pattern n is a local minimum at alpha = 0 (see the module note). */
function classicalStable(p: CellProblem, n: ArrayLike<number>, xi: Float64Array): boolean {
  hartree(p, n, xi);
  let inv = 0;
  for (let s = 0; s < p.M; s++) {
    if (n[s] ? !(xi[s] < 0) : !(xi[s] > 0)) return false;
    inv += 1 / Math.abs(xi[s]);
  }
  return inv / p.M < p.delta - p.mu;
}

/**
 * Single-sublattice flips of an integer pattern while one lowers the energy: flipping s
 * changes M e by (1 - 2 n_s) xi_s + J_ss/2; the most favourable flip first, so the energy
 * falls strictly and the walk ends at a pattern no single flip improves.
 */
function classicalDescent(p: CellProblem, n0: ArrayLike<number>): Float64Array {
  const M = p.M, n = Float64Array.from(n0), xi = new Float64Array(M);
  hartree(p, n, xi);
  for (let k = 0; k < 4 * M * M; k++) {
    let best = -1, gain = -1e-12 * (1 + Math.abs(p.mu));
    for (let s = 0; s < M; s++) {
      const dE = (1 - 2 * n[s]) * xi[s] + p.J[s * M + s] / 2;
      if (dE < gain) { gain = dE; best = s; }
    }
    if (best < 0) break;
    const sign = n[best] ? -1 : 1;
    n[best] = 1 - n[best];
    for (let s = 0; s < M; s++) xi[s] += sign * p.J[s * M + best];
  }
  return n;
}

/**
 * The integer pattern solveAngles really starts from when m0 is an integer pattern: m0
 * after the single-flip descent (classicalDescent), or null when m0 is not integer. The
 * angle solver's result depends on an integer start only through this pattern (the descent
 * of a descended pattern is itself), so two integer starts with the same descended pattern
 * give the same solution and the search solves only the first.
 */
export function descendedPattern(p: CellProblem, m0: ArrayLike<number>): Float64Array | null {
  for (let s = 0; s < p.M; s++) if (m0[s] !== 0 && m0[s] !== 1) return null;
  return classicalDescent(p, m0);
}

/**
 * Near a saddle the gradient can lie in a symmetric subspace that Newton steps never leave
 * (a uniform state in a 2-site cell, say). Add the direction of most negative curvature,
 * found by inverse iteration with the shifted factor L from a vector with no symmetry,
 * signed downhill, to the step d (both scaled to unit max-norm).
 */
function addNegativeCurvature(L: Float64Array, M: number, grad: Float64Array, d: Float64Array, v: Float64Array): void {
  softestDirection(L, M, grad, 6, v);
  let dn = 0;
  for (let s = 0; s < M; s++) dn = Math.max(dn, Math.abs(d[s]));
  for (let s = 0; s < M; s++) d[s] = (dn > 0 ? d[s] / dn : 0) + v[s];
}

/** Energy scale of the Hartree shift in the step test (g = 1): |dxi| < tol is asked too. */
const XI_SCALE = 1;

/** Phi and its pieces at theta (m, sin, cos, xi into the work arrays); returns Phi. */
function energy(p: CellProblem, th: Float64Array, m: Float64Array, sn: Float64Array, cs: Float64Array, xi: Float64Array): number {
  const M = p.M, dmu = p.delta - p.mu;
  let X = 0;
  for (let s = 0; s < M; s++) {
    cs[s] = Math.cos(th[s]); sn[s] = Math.sin(th[s]);
    // m = sin^2(theta/2), not (1 - cos theta)/2: a blockaded emitter has m ~ V^-1 far below
    // the 1e-16 resolution of 1 - cos theta, and J m must stay exact for V up to ~1e300.
    const h = Math.sin(th[s] / 2);
    m[s] = h * h; X += sn[s];
  }
  X /= M;
  hartree(p, m, xi);
  let e = 0;
  for (let s = 0; s < M; s++) e += m[s] * (xi[s] - p.mu);
  return e / (2 * M) - (X * X) / (4 * dmu);
}

/**
 * Work arrays of solveAngles for one M, reused from call to call (plain scratch: every
 * entry is written before it is read, so the results are those of fresh arrays). A
 * re-entrant call (from a trace or abandon callback) gets fresh arrays.
 */
interface Work {
  busy: boolean;
  m: Float64Array; sn: Float64Array; cs: Float64Array; xi: Float64Array; th: Float64Array;
  tm: Float64Array; tsn: Float64Array; tcs: Float64Array; txi: Float64Array; tth: Float64Array;
  grad: Float64Array; d: Float64Array; v: Float64Array; H: Float64Array; L: Float64Array;
}

const works = new Map<number, Work>();

function newWork(M: number): Work {
  const f = () => new Float64Array(M);
  return {
    busy: false, m: f(), sn: f(), cs: f(), xi: f(), th: f(), tm: f(), tsn: f(), tcs: f(), txi: f(), tth: f(),
    grad: f(), d: f(), v: f(), H: new Float64Array(M * M), L: new Float64Array(M * M),
  };
}

/** Newton minimisation of Phi(theta) from the start m0 (T = 0 only). */
export function solveAngles(p: CellProblem, m0: ArrayLike<number>, opts: SolveCellOptions = {}): AngleResult {
  const M = p.M;
  let integer = true;
  for (let s = 0; s < M; s++) if (m0[s] !== 0 && m0[s] !== 1) integer = false;
  if (integer) {
    const n = classicalDescent(p, m0), xi = new Float64Array(M);
    if (classicalStable(p, n, xi)) return { m: n, sx: new Float64Array(M), xi, alpha: 0, converged: true, iterations: 0, step: 0 };
    m0 = n;
  }
  let w = works.get(M);
  if (!w) works.set(M, w = newWork(M));
  if (w.busy) w = newWork(M);
  w.busy = true;
  try {
    return newton(p, m0, opts, w);
  } finally {
    w.busy = false;
  }
}

/** The Newton iteration of solveAngles from a start that is not a stable integer pattern. */
function newton(p: CellProblem, m0: ArrayLike<number>, opts: SolveCellOptions, w: Work): AngleResult {
  const M = p.M, tol = opts.tol ?? 1e-12, maxIter = opts.maxIter ?? 100, dmu = p.delta - p.mu;
  let { th, m, sn, cs, xi, tth, tm, tsn, tcs, txi } = w;
  const { grad, d, H, L, v } = w;
  for (let s = 0; s < M; s++) {
    const t = Math.acos(Math.min(1, Math.max(-1, 1 - 2 * m0[s])));
    th[s] = Math.min(Math.PI - KICK, Math.max(KICK, t));
  }
  let phi = energy(p, th, m, sn, cs, xi);
  let converged = false, it = 0, step = Infinity;
  for (it = 1; it <= maxIter; it++) {
    let X = 0;
    for (let s = 0; s < M; s++) X += sn[s];
    const alpha = X / M / (2 * dmu);
    for (let s = 0; s < M; s++) {
      grad[s] = (xi[s] * sn[s] / 2 - alpha * cs[s]) / M;
      for (let t = 0; t < M; t++) {
        H[s * M + t] = (p.J[s * M + t] * sn[s] * sn[t] / 4 - cs[s] * cs[t] / (2 * M * dmu)) / M;
      }
      H[s * M + s] += (xi[s] * cs[s] / 2 + alpha * sn[s]) / M;
    }
    // Levenberg shift: none where H is positive definite, else twice the least that makes it so.
    const shift = levenbergFactor(H, M, L);
    for (let s = 0; s < M; s++) d[s] = -grad[s];
    choleskySolve(L, M, d);
    if (shift > 0) addNegativeCurvature(L, M, grad, d, v);
    // Trust region: no angle moves by more than MAX_TURN in one step. Where the Hessian is
    // not positive definite (near a saddle or a maximum) the shifted step points along the
    // negative curvature and is stretched to the full trust radius (the line search trims it).
    let dMax = 0;
    for (let s = 0; s < M; s++) dMax = Math.max(dMax, Math.abs(d[s]));
    if (dMax > MAX_TURN || (shift > 0 && dMax > 0)) for (let s = 0; s < M; s++) d[s] *= MAX_TURN / dMax;
    let g = 0;
    for (let s = 0; s < M; s++) g += grad[s] * d[s];
    const slack = 1e-14 * (1 + Math.abs(phi));
    let lambda = 1, ok = false, tphi = phi;
    for (let bt = 0; bt < 40; bt++) {
      for (let s = 0; s < M; s++) tth[s] = th[s] + lambda * d[s];
      tphi = energy(p, tth, tm, tsn, tcs, txi);
      if (tphi <= phi + 1e-4 * lambda * g + slack) { ok = true; break; }
      lambda /= 2;
    }
    if (!ok) break;
    step = 0;
    // m and <sigma^x> both: near alpha = 0, m ~ theta^2 settles long before sin theta does.
    // And xi: under a strong blockade m ~ 1/V is far below tol while V dm still moves xi.
    for (let s = 0; s < M; s++) step = Math.max(step, Math.abs(tm[s] - m[s]), Math.abs(tsn[s] - sn[s]), Math.abs(txi[s] - xi[s]) / XI_SCALE);
    // the trial point becomes the current one (the buffers swap; the old ones are the next trial's)
    [th, tth] = [tth, th]; [m, tm] = [tm, m]; [sn, tsn] = [tsn, sn]; [cs, tcs] = [tcs, cs]; [xi, txi] = [txi, xi];
    phi = tphi;
    opts.trace?.(m, alpha, phi, lambda);
    if (step < tol && lambda === 1) { converged = true; break; }
    if (opts.abandon?.(m, it)) break;
  }
  let X = 0;
  for (let s = 0; s < M; s++) X += sn[s];
  const alphaSigned = X / M / (2 * dmu);
  const sign = alphaSigned < 0 ? -1 : 1;
  const sx = Float64Array.from(sn, (x) => -sign * x);
  return { m: m.slice(), sx, xi: xi.slice(), alpha: Math.abs(alphaSigned), converged, iterations: Math.min(it, maxIter), step };
}
