/**
 * Finite-temperature sublattice mean-field in one cell by Newton on the trial fields.
 * The unknowns are the fields h = (zeta_1..zeta_M, beta) of a trial product state
 * (emitter s in h_s = zeta_s n + beta sigma^x, thermal at T); self-consistency is
 * h = H(h), H = (xi_s(m(h)), alpha(x(h))), alpha = -mean x/(2(delta-mu)) the photon that
 * minimises the energy for given emitters. Newton on r(h) = H(h) - h, (1 - dH/dh) dh = r, is
 * globalised by a line search on the Gibbs-Bogoliubov free energy of the trial state
 *
 *   Phi(h) = (1/M) sum_s [-T S_s] + e(m, x),
 *   e = -mu mean m + (1/2M) m.J.m - (mean x)^2 / (4 (delta - mu)),
 *
 * whose stationary points are exactly the mean-field solutions, where it equals Omega
 * (Bogoliubov's inequality makes it an upper bound of the free energy of the trial family).
 * Its gradient is (1/M) chi r with chi = d(m, x)/d(zeta, beta) negative semidefinite, so the
 * plain step dh = r always descends and is the fallback when the Newton step does not: the
 * iteration converges to minima and never cycles. Fields are unbounded, so no step is
 * clipped. Converged when a full step changes m and <sigma^x> by less than tol (1e-12).
 */
import { photonDensity } from './emitter.ts';
import { gaussSolve } from '../numerics/dense-solve.ts';
import type { CellProblem, SolveCellOptions } from './cell-problem.ts';
import { hartreeShifts } from './hartree-shift.ts';
import { type Trial, evaluate, negativeCurvature, newTrial, slope } from './trial-state.ts';

/** The solution's observables. */
export interface FieldResult {
  m: Float64Array; sx: Float64Array; xi: Float64Array; alpha: number;
  converged: boolean; iterations: number; step: number;
}


/** The Hartree fields of m and the photon alpha they support: h = (xi(m), alpha(xi)). */
export function fieldsOf(p: CellProblem, m: ArrayLike<number>): Float64Array {
  const M = p.M, h = new Float64Array(M + 1);
  hartreeShifts(p.J, M, p.mu, m, h);
  h[M] = Math.sqrt(photonDensity(h.subarray(0, M), p.delta - p.mu, p.T));
  return h;
}

/** Newton iteration on the fields from the start m0 (T > 0; also valid at T = 0). */
export function solveFields(p: CellProblem, m0: ArrayLike<number>, opts: SolveCellOptions = {}): FieldResult {
  const M = p.M;
  let h = fieldsOf(p, m0);
  // Seed a small photon so that the start is not confined to the uncondensed subspace.
  if (h[M] === 0) h[M] = 1e-4 / Math.max(1, p.delta - p.mu);
  let r = iterate(p, h, opts), iterations = r.iterations;
  // alpha = 0 is an invariant subspace of the iteration: a state that reached it is kept only
  // if it is stable against condensation (the photon equation has no root for its xi).
  for (let k = 0; k < 3 && r.converged && Math.abs(r.h[M]) < 1e-13; k++) {
    const a = photonDensity(r.cur.xi, p.delta - p.mu, p.T);
    if (!(a > 0)) break;
    h = new Float64Array(M + 1);
    h.set(r.cur.xi);
    h[M] = Math.sqrt(a);
    r = iterate(p, h, opts);
    iterations += r.iterations;
  }
  const { cur, converged, step } = r;
  h = r.h;
  const sign = h[M] < 0 ? -1 : 1;
  return {
    m: Float64Array.from(cur.m), sx: Float64Array.from(cur.x, (x) => sign * x), xi: Float64Array.from(cur.xi),
    alpha: Math.abs(h[M]), converged, iterations, step,
  };
}

/** The damped Newton iteration from fields h (see the module note). */
function iterate(p: CellProblem, h: Float64Array, opts: SolveCellOptions): { h: Float64Array; cur: Trial; converged: boolean; iterations: number; step: number } {
  const M = p.M, n = M + 1, tol = opts.tol ?? 1e-12, maxIter = opts.maxIter ?? 100;
  let cur = newTrial(M), next = newTrial(M);
  evaluate(p, h, cur, true);
  const A = new Float64Array(n * n), d = new Float64Array(n), trialH = new Float64Array(n);
  let converged = false, it = 0, step = Infinity;
  for (it = 1; it <= maxIter; it++) {
    // Newton direction: (1 - dH/dh) d = r.
    const c = 1 / (2 * M * (p.delta - p.mu));
    for (let s = 0; s < M; s++) {
      let col = 0;
      for (let u = 0; u < M; u++) {
        A[s * n + u] = -p.J[s * M + u] * cur.cmz[u];
        col += p.J[s * M + u] * cur.cmb[u];
      }
      A[s * n + M] = -col;
      A[M * n + s] = c * cur.cmb[s];
      d[s] = cur.xi[s] - h[s];
    }
    let cxSum = 0;
    for (let s = 0; s < M; s++) cxSum += cur.cxb[s];
    A[M * n + M] = c * cxSum;
    for (let i = 0; i < n; i++) A[i * n + i] += 1;
    d[M] = cur.alpha - h[M];
    const plain = Float64Array.from(d);
    let dir: Float64Array = gaussSolve(A, d, n) ? d : plain;
    let g = slope(p, cur, h, dir);
    let usedPlain = false, curvatureDir: Float64Array | null = null;
    if (!(g < 0)) { dir = plain; g = slope(p, cur, h, dir); usedPlain = true; }
    // Slow progress suggests a saddle: step along its negative curvature instead.
    if (usedPlain && it > 3 && step > tol) {
      const v = negativeCurvature(p, h, cur, next);
      if (v) { dir = v; curvatureDir = v; g = slope(p, cur, h, dir); }
    }
    // Near convergence test the plain map itself: if h -> H(h) moves m and x by less than
    // tol the state is self-consistent, whatever the rounding of Phi says about the step.
    if (step < 1e-8) {
      for (let i = 0; i < n; i++) trialH[i] = h[i] + plain[i];
      evaluate(p, trialH, next, true);
      let move = 0;
      for (let s = 0; s < M; s++) move = Math.max(move, Math.abs(next.m[s] - cur.m[s]), Math.abs(next.x[s] - cur.x[s]));
      if (move < tol) { h = Float64Array.from(trialH); [cur, next] = [next, cur]; step = move; converged = true; break; }
    }
    // Backtracking (Armijo) on Phi, with a rounding allowance so that the last Newton
    // steps, whose gain is below the rounding of Phi, are taken.
    const slack = 1e-14 * (1 + Math.abs(cur.phi));
    let lambda = 1, ok = false;
    for (let bt = 0; bt < 30; bt++) {
      for (let i = 0; i < n; i++) trialH[i] = h[i] + lambda * dir[i];
      evaluate(p, trialH, next, true);
      if (next.phi <= cur.phi + 1e-4 * lambda * Math.min(g, 0) + slack) { ok = true; break; }
      lambda /= 2;
      if (bt === 3 && dir !== plain) { dir = plain; g = slope(p, cur, h, dir); lambda = 1; }
    }
    if (!ok) break;
    step = 0;
    for (let s = 0; s < M; s++) step = Math.max(step, Math.abs(next.m[s] - cur.m[s]), Math.abs(next.x[s] - cur.x[s]));
    h = Float64Array.from(trialH);
    [cur, next] = [next, cur];
    opts.trace?.(cur.m, h[M], cur.phi, lambda);
    // A full Newton or plain step that no longer moves m: self-consistent (a shortened step,
    // or one along the negative curvature, proves nothing).
    if (step < tol && lambda === 1 && dir !== curvatureDir) { converged = true; break; }
    if (opts.abandon?.(cur.m, it)) break;
    // Photon jump: Phi is flat in beta near beta = 0 (it falls like -beta^2 where the photon
    // condenses), so Newton and plain steps escape the uncondensed region only slowly. Try
    // the photon root for the present zeta (beta solved at fixed emitter fields) instead.
    const bStar = Math.sqrt(photonDensity(h.subarray(0, M), p.delta - p.mu, p.T));
    if (bStar > 1.5 * Math.abs(h[M])) {
      trialH.set(h); trialH[M] = bStar;
      evaluate(p, trialH, next, true);
      if (next.phi < cur.phi - slack) { h = Float64Array.from(trialH); [cur, next] = [next, cur]; }
    }
  }
  return { h, cur, converged, iterations: Math.min(it, maxIter), step };
}

