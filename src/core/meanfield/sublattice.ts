/**
 * Sublattice mean-field in one supercell of M sublattices, from one start (DESIGN.md,
 * "Sublattice mean-field at temperature T"):
 *
 *   xi_s = -mu + sum_t J_st(0) m_t,   E_s = sqrt(xi_s^2/4 + alpha^2),
 *   m_s = (1 - xi_s tanh(E_s/T)/(2E_s))/2,
 *   (delta - mu) = (1/M) sum_s tanh(E_s/T)/(2E_s)   (or alpha = 0 when it has no root),
 *   Omega = (delta-mu) alpha^2 + (1/M) sum_s [xi_s/2 - T ln 2cosh(E_s/T)]
 *           - (1/(2M)) sum_st J_st m_s m_t            (T = 0: -T ln 2cosh -> -E_s).
 *
 * Method: Newton on the fixed point m = F(m), with alpha^2 = a(m) solved inside
 * (emitter.ts). With D_s = dm_s/dxi_s, C_s = dm_s/da and, for a > 0,
 * da/dm_t = sum_u w_u J_ut,  w_u = -(dg_u/dxi_u) / sum_v (dg_v/da), the Jacobian is
 * dF/dm = (diag D + C w^T) J. Each step solves (1 - dF/dm) dm = F(m) - m, with
 * backtracking on the residual and plain iteration as the fallback. At T = 0 with a = 0 the
 * map is piecewise constant (D = 0) and Newton is plain iteration: an integer pattern that
 * is self-consistent converges in one step. Converged when |dm| < tol (1e-12) for the
 * Newton step or the residual.
 */
import { gOf, qOf, occupation, levelFreeEnergy, photonDensity } from './emitter.ts';

/** One supercell's problem: J_st(0) row-major (M x M), mu, delta, T. */
export interface CellProblem {
  readonly M: number;
  readonly J: Float64Array;
  readonly mu: number;
  readonly delta: number;
  readonly T: number;
}

/** A self-consistent (or best-effort, converged = false) solution in one cell. */
export interface CellSolution {
  /** m_s per sublattice. */
  m: Float64Array;
  /** <sigma^x>_s per sublattice. */
  sx: Float64Array;
  alpha: number;
  /** Omega per site. */
  omega: number;
  converged: boolean;
  iterations: number;
  /** max_s |dm_s| of the last step. */
  step: number;
}

export interface SolveCellOptions {
  tol?: number;
  maxIter?: number;
}

/** Work arrays of the iteration, one set per call. */
interface Work {
  xi: Float64Array; F: Float64Array; D: Float64Array; C: Float64Array; w: Float64Array;
  A: Float64Array; r: Float64Array; a: number;
}

/** Evaluate F(m) (into w.F) and, if `jac`, the pieces of its Jacobian. Returns a = alpha^2. */
function evaluate(p: CellProblem, m: Float64Array, w: Work, jac: boolean): number {
  const { M, J, mu, T } = p;
  const dmu = p.delta - mu;
  for (let s = 0; s < M; s++) {
    let x = -mu;
    for (let t = 0; t < M; t++) x += J[s * M + t] * m[t];
    w.xi[s] = x;
  }
  const a = photonDensity(w.xi, dmu, T, w.a);
  w.a = a;
  let dgdaSum = 0;
  for (let s = 0; s < M; s++) {
    const xi = w.xi[s];
    const E = Math.sqrt(xi * xi / 4 + a);
    const g = gOf(E, T);
    w.F[s] = occupation(xi, a, E, g, T);
    if (!jac) continue;
    if (T === 0 && a === 0) { w.D[s] = 0; w.C[s] = 0; w.w[s] = 0; continue; }
    const q = qOf(E, T);
    w.D[s] = -(g + xi * xi * q / 4) / 2;
    w.C[s] = -xi * q / 4;
    w.w[s] = q * xi / 4;
    dgdaSum += q / 2;
  }
  if (jac) {
    if (a > 0 && dgdaSum < 0) for (let s = 0; s < M; s++) w.w[s] = -w.w[s] / dgdaSum;
    else w.w.fill(0);
  }
  return a;
}

/** Solve A x = b in place (A row-major n x n, destroyed; b becomes x). Partial pivoting. */
function gaussSolve(A: Float64Array, b: Float64Array, n: number): boolean {
  for (let k = 0; k < n; k++) {
    let piv = k, best = Math.abs(A[k * n + k]);
    for (let i = k + 1; i < n; i++) { const v = Math.abs(A[i * n + k]); if (v > best) { best = v; piv = i; } }
    if (!(best > 1e-300)) return false;
    if (piv !== k) {
      for (let j = 0; j < n; j++) { const t = A[k * n + j]; A[k * n + j] = A[piv * n + j]; A[piv * n + j] = t; }
      const t = b[k]; b[k] = b[piv]; b[piv] = t;
    }
    const inv = 1 / A[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const f = A[i * n + k] * inv;
      if (f === 0) continue;
      for (let j = k + 1; j < n; j++) A[i * n + j] -= f * A[k * n + j];
      b[i] -= f * b[k];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i];
    for (let j = i + 1; j < n; j++) s -= A[i * n + j] * b[j];
    b[i] = s / A[i * n + i];
  }
  return true;
}

function maxAbsDiff(x: Float64Array, y: Float64Array): number {
  let d = 0;
  for (let i = 0; i < x.length; i++) { const v = Math.abs(x[i] - y[i]); if (v > d) d = v; }
  return d;
}

/** Newton iteration of the sublattice equations in one cell from the start m0. */
export function solveCell(p: CellProblem, m0: ArrayLike<number>, opts: SolveCellOptions = {}): CellSolution {
  const M = p.M, tol = opts.tol ?? 1e-12, maxIter = opts.maxIter ?? 80;
  const mk = () => new Float64Array(M);
  const w: Work = { xi: mk(), F: mk(), D: mk(), C: mk(), w: mk(), A: new Float64Array(M * M), r: mk(), a: 0 };
  const m = Float64Array.from(m0, (v) => Math.min(1, Math.max(0, v)));
  const trial = mk();
  let converged = false, it = 0, step = Infinity;
  evaluate(p, m, w, true);
  let res = maxAbsDiff(w.F, m);
  for (it = 1; it <= maxIter; it++) {
    if (res < tol) { converged = true; step = res; break; }
    // Newton direction: (1 - (diag D + C w^T) J) dm = F - m.
    const { A, r, D, C } = w;
    for (let s = 0; s < M; s++) {
      for (let t = 0; t < M; t++) A[s * M + t] = -D[s] * p.J[s * M + t];
      r[s] = w.F[s] - m[s];
    }
    if (p.T !== 0 || w.a > 0) {
      for (let t = 0; t < M; t++) {
        let wJt = 0;
        for (let u = 0; u < M; u++) wJt += w.w[u] * p.J[u * M + t];
        if (wJt !== 0) for (let s = 0; s < M; s++) A[s * M + t] -= C[s] * wJt;
      }
    }
    for (let s = 0; s < M; s++) A[s * M + s] += 1;
    const ok = gaussSolve(A, r, M);
    const dir = ok ? r : Float64Array.from(w.F, (f, s) => f - m[s]);
    step = 0;
    for (let s = 0; s < M; s++) step = Math.max(step, Math.abs(dir[s]));
    // Backtracking on the residual max|F - m|.
    const aSaved = w.a;
    let lambda = 1, accepted = false, newRes = Infinity;
    for (let bt = 0; bt < 6; bt++) {
      for (let s = 0; s < M; s++) trial[s] = Math.min(1, Math.max(0, m[s] + lambda * dir[s]));
      w.a = aSaved;
      evaluate(p, trial, w, false);
      newRes = maxAbsDiff(w.F, trial);
      if (newRes < res || newRes < tol) { accepted = true; break; }
      lambda /= 2;
    }
    if (!accepted) {
      // Fall back to the plain iteration m <- F(m) (first F, recomputed at m).
      w.a = aSaved;
      evaluate(p, m, w, false);
      for (let s = 0; s < M; s++) trial[s] = w.F[s];
    }
    m.set(trial);
    if (step < tol) { evaluate(p, m, w, true); converged = true; break; }
    evaluate(p, m, w, true);
    res = maxAbsDiff(w.F, m);
  }
  return finish(p, m, w, converged, Math.min(it, maxIter), step);
}

/** The observables and Omega of the state m (with a = a(m) solved once more). */
function finish(p: CellProblem, m: Float64Array, w: Work, converged: boolean, iterations: number, step: number): CellSolution {
  const { M, mu, T } = p;
  const a = w.a;
  const alpha = Math.sqrt(a);
  const sx = new Float64Array(M);
  let local = 0, hartree = 0;
  for (let s = 0; s < M; s++) {
    const xi = w.xi[s];
    const E = Math.sqrt(xi * xi / 4 + a);
    sx[s] = a > 0 ? -2 * alpha * gOf(E, T) : 0;
    local += xi / 2 + levelFreeEnergy(E, T);
    hartree += m[s] * (xi + mu);
  }
  const omega = (p.delta - mu) * a + local / M - hartree / (2 * M);
  return { m, sx, alpha, omega, converged, iterations, step };
}
