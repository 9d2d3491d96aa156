/**
 * Ground state of a real symmetric operator by restarted Lanczos with two passes
 * (Lanczos, J. Res. Natl. Bur. Stand. 45, 255 (1950); the two-pass, low-memory form as in
 * Cullum and Willoughby, Lanczos Algorithms for Large Symmetric Eigenvalue Computations (1985)).
 *
 * Pass 1 builds the tridiagonal T of the Krylov space of the start vector v0,
 *   beta_{j+1} v_{j+1} = H v_j - a_j v_j - beta_j v_{j-1},
 * keeping only three vectors, until the lowest Ritz value theta (bisection on the Sturm
 * sequence of T) has converged. Pass 2 regenerates the v_j from v0 and sums the Ritz vector
 * x = sum_j y_j v_j (y by inverse iteration on T). Pass 1 stops when the residual estimate
 * b_{j+1} |y_j| is below tolerance. E = <x|H|x> with residual |Hx - E x|;
 * if the residual is above tolerance the run restarts from x. Memory: five vectors of D.
 */
import { ConvergenceError } from '../convergence-error.ts';

export interface LanczosOptions {
  /** Start vector (copied, normalised); default the uniform positive vector. */
  start?: Float64Array;
  /** Stop when |H x - E x| <= tolerance * max(1, |E|). */
  tolerance?: number;
  /** Largest Krylov dimension per pass. */
  maxKrylov?: number;
  maxRestarts?: number;
}

export interface LanczosResult {
  energy: number;
  /** Normalised ground vector. */
  vector: Float64Array;
  /** Total Lanczos steps (matrix-vector products of pass 1). */
  iterations: number;
  residual: number;
}

type Apply = (x: Float64Array, y: Float64Array) => void;

/** Relative residual above which the restarted iteration has failed (1e4 times the default tol). */
const GIVE_UP = 1e-6;

/** Lowest eigenpair of the operator `apply` on vectors of length D. */
export function lanczosGround(apply: Apply, D: number, opts: LanczosOptions = {}): LanczosResult {
  const tol = opts.tolerance ?? 1e-10, maxK = Math.min(opts.maxKrylov ?? 400, D), maxRestarts = opts.maxRestarts ?? 30;
  const x = opts.start ? Float64Array.from(opts.start) : new Float64Array(D).fill(1);
  normalise(x);
  const w = new Float64Array(D), vPrev = new Float64Array(D), v = new Float64Array(D);
  let iterations = 0, energy = NaN, residual = Infinity;
  for (let restart = 0; restart <= maxRestarts; restart++) {
    // Pass 1: the tridiagonal a_j, b_j (b_j couples v_{j-1} and v_j).
    const a: number[] = [], b: number[] = [0];
    v.set(x); vPrev.fill(0);
    let theta = Infinity, y: Float64Array = new Float64Array(1);
    for (let j = 0; j < maxK; j++) {
      apply(v, w); iterations++;
      const aj = dot(w, v);
      a.push(aj);
      for (let s = 0; s < D; s++) w[s] -= aj * v[s] + b[j] * vPrev[s];
      const bj = Math.sqrt(dot(w, w));
      theta = lowestEigenvalue(a, b);
      y = tridiagonalEigenvector(a, b, theta);
      // |H x - theta x| = b_{j+1} |y_j| for the Ritz vector x of this Krylov space.
      const estimate = bj * Math.abs(y[j]), scale = Math.max(1, Math.abs(theta));
      if (bj <= 1e-13 * scale || estimate <= 0.1 * tol * scale || j === maxK - 1) break;
      b.push(bj);
      for (let s = 0; s < D; s++) { vPrev[s] = v[s]; v[s] = w[s] / bj; }
    }
    // Pass 2: x = sum_j y_j v_j with the same recurrence.
    v.set(x); vPrev.fill(0); x.fill(0);
    for (let j = 0; j < a.length; j++) {
      for (let s = 0; s < D; s++) x[s] += y[j] * v[s];
      if (j === a.length - 1) break;
      apply(v, w);
      for (let s = 0; s < D; s++) { w[s] -= a[j] * v[s] + b[j] * vPrev[s]; vPrev[s] = v[s]; v[s] = w[s] / b[j + 1]; }
    }
    normalise(x);
    apply(x, w);
    energy = dot(x, w);
    for (let s = 0; s < D; s++) w[s] -= energy * x[s];
    residual = Math.sqrt(dot(w, w));
    if (residual <= tol * Math.max(1, Math.abs(energy))) break;
  }
  // A residual far above tol after every restart (or a NaN) is a failure, not an answer.
  if (!(residual <= GIVE_UP * Math.max(1, Math.abs(energy)))) {
    throw new ConvergenceError('Lanczos', `residual ${residual} after ${maxRestarts} restarts (${iterations} steps)`);
  }
  return { energy, vector: x, iterations, residual };
}

function dot(p: Float64Array, q: Float64Array): number {
  let s = 0;
  for (let i = 0; i < p.length; i++) s += p[i] * q[i];
  return s;
}

function normalise(p: Float64Array): void {
  const n = Math.sqrt(dot(p, p));
  for (let i = 0; i < p.length; i++) p[i] /= n;
}

/** Number of eigenvalues of the tridiagonal (a, b) below x (Sturm sequence of the LDL^T pivots). */
function countBelow(a: number[], b: number[], x: number): number {
  let count = 0, d = 1;
  for (let j = 0; j < a.length; j++) {
    d = a[j] - x - (j > 0 ? (b[j] * b[j]) / d : 0);
    if (d === 0) d = -1e-300;
    if (d < 0) count++;
  }
  return count;
}

/** Lowest eigenvalue of the symmetric tridiagonal (a, b) by bisection inside its Gershgorin interval. */
export function lowestEigenvalue(a: number[], b: number[]): number {
  let lo = Infinity, hi = -Infinity;
  for (let j = 0; j < a.length; j++) {
    const r = Math.abs(b[j] ?? 0) + Math.abs(j + 1 < a.length ? b[j + 1] : 0);
    lo = Math.min(lo, a[j] - r); hi = Math.max(hi, a[j] + r);
  }
  for (let it = 0; it < 200 && hi - lo > 1e-15 * Math.max(1, Math.abs(lo), Math.abs(hi)); it++) {
    const mid = 0.5 * (lo + hi);
    if (mid === lo || mid === hi) break;
    if (countBelow(a, b, mid) >= 1) hi = mid; else lo = mid;
  }
  return 0.5 * (lo + hi);
}

/** Normalised eigenvector of the tridiagonal (a, b) for the eigenvalue theta: inverse iteration. */
function tridiagonalEigenvector(a: number[], b: number[], theta: number): Float64Array {
  const m = a.length;
  const shift = theta - 1e-10 * Math.max(1, Math.abs(theta));
  let y: Float64Array = new Float64Array(m).fill(1 / Math.sqrt(m));
  for (let it = 0; it < 3; it++) {
    // Solve (T - shift) z = y by Gaussian elimination with partial pivoting on the band.
    y = solveTridiagonal(a.map((aj) => aj - shift), b, y);
    let n = 0;
    for (let j = 0; j < m; j++) n += y[j] * y[j];
    n = Math.sqrt(n);
    for (let j = 0; j < m; j++) y[j] /= n;
  }
  if (y[0] < 0) for (let j = 0; j < m; j++) y[j] = -y[j];
  return y;
}

/** Solve the symmetric tridiagonal system (diag d, off-diagonal b[1..m-1]) with partial pivoting. */
function solveTridiagonal(d: number[], b: number[], rhs: Float64Array): Float64Array {
  const m = d.length;
  // Rows as bands [l, c, u, uu] after pivoting: c diagonal, u first and uu second super-diagonal.
  const c = Float64Array.from(d), u = new Float64Array(m), uu = new Float64Array(m), l = new Float64Array(m);
  const r = Float64Array.from(rhs);
  for (let j = 0; j < m - 1; j++) u[j] = b[j + 1];
  for (let j = 1; j < m; j++) l[j] = b[j];
  for (let j = 0; j < m - 1; j++) {
    if (Math.abs(l[j + 1]) > Math.abs(c[j])) {
      // Swap rows j and j+1.
      const c0 = c[j], u0 = u[j], uu0 = uu[j], r0 = r[j];
      c[j] = l[j + 1]; u[j] = c[j + 1]; uu[j] = u[j + 1]; r[j] = r[j + 1];
      l[j + 1] = c0; c[j + 1] = u0; u[j + 1] = uu0; r[j + 1] = r0;
    }
    const piv = c[j] === 0 ? 1e-300 : c[j];
    const f = l[j + 1] / piv;
    c[j + 1] -= f * u[j]; u[j + 1] -= f * uu[j]; r[j + 1] -= f * r[j];
    l[j + 1] = 0;
  }
  const z = new Float64Array(m);
  for (let j = m - 1; j >= 0; j--) {
    const piv = c[j] === 0 ? 1e-300 : c[j];
    z[j] = (r[j] - (j + 1 < m ? u[j] * z[j + 1] : 0) - (j + 2 < m ? uu[j] * z[j + 2] : 0)) / piv;
  }
  return z;
}
