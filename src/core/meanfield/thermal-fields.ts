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
import { gOf, qOf, occupation, levelFreeEnergy, photonDensity } from './emitter.ts';
import { gaussSolve } from './dense-solve.ts';
import type { CellProblem, SolveCellOptions } from './sublattice.ts';

/** The solution's observables. */
export interface FieldResult {
  m: Float64Array; sx: Float64Array; xi: Float64Array; alpha: number;
  converged: boolean; iterations: number; step: number;
}

/** The trial state of fields h: occupations m, coherences x, their derivatives, Phi. */
interface Trial {
  m: Float64Array; x: Float64Array;
  cmz: Float64Array; cmb: Float64Array; cxb: Float64Array;
  /** Hartree fields xi(m) and the photon alpha(x). */
  xi: Float64Array; alpha: number;
  phi: number;
}

function newTrial(M: number): Trial {
  const f = () => new Float64Array(M);
  return { m: f(), x: f(), cmz: f(), cmb: f(), cxb: f(), xi: f(), alpha: 0, phi: 0 };
}

/** Evaluate the trial state of fields h into t (and, if `deriv`, chi). */
function evaluate(p: CellProblem, h: Float64Array, t: Trial, deriv: boolean): void {
  const { M, J, mu, T } = p;
  const beta = h[M], dmu = p.delta - mu;
  let entropyTerm = 0, xSum = 0;
  for (let s = 0; s < M; s++) {
    const z = h[s];
    const E = Math.sqrt(z * z / 4 + beta * beta);
    if (E === 0) { // T = 0 degenerate level: no preferred state; take the midpoint.
      t.m[s] = 0.5; t.x[s] = 0; t.cmz[s] = 0; t.cmb[s] = 0; t.cxb[s] = 0;
      continue;
    }
    const g = gOf(E, T);
    const m = occupation(z, beta * beta, E, g, T);
    const x = -2 * beta * g;
    t.m[s] = m; t.x[s] = x; xSum += x;
    if (T > 0) entropyTerm += levelFreeEnergy(E, T) + z / 2 - z * m - beta * x;
    if (deriv) {
      const q = qOf(E, T);
      t.cmz[s] = -(g + z * z * q / 4) / 2;
      t.cmb[s] = -z * beta * q / 2;
      t.cxb[s] = -2 * g - 2 * beta * beta * q;
    }
  }
  let e = 0;
  for (let s = 0; s < M; s++) {
    let xi = -mu;
    for (let u = 0; u < M; u++) xi += J[s * M + u] * t.m[u];
    t.xi[s] = xi;
    e += t.m[s] * (xi - mu); // m (J m) - 2 mu m, halved below
  }
  const xMean = xSum / M;
  t.alpha = -xMean / (2 * dmu);
  t.phi = entropyTerm / M + e / (2 * M) - (xMean * xMean) / (4 * dmu);
}

/** Directional derivative of Phi along d: (1/M) sum_s r_s . chi_s . d_s (beta shared). */
function slope(p: CellProblem, t: Trial, h: Float64Array, d: Float64Array): number {
  const M = p.M, rb = t.alpha - h[M], db = d[M];
  let s = 0;
  for (let i = 0; i < M; i++) {
    const rz = t.xi[i] - h[i];
    s += rz * (t.cmz[i] * d[i] + t.cmb[i] * db) + rb * (t.cmb[i] * d[i] + t.cxb[i] * db);
  }
  return s / M;
}

/** The Hartree fields of m and the photon alpha they support: h = (xi(m), alpha(xi)). */
export function fieldsOf(p: CellProblem, m: ArrayLike<number>): Float64Array {
  const M = p.M, h = new Float64Array(M + 1);
  for (let s = 0; s < M; s++) {
    let xi = -p.mu;
    for (let u = 0; u < M; u++) xi += p.J[s * M + u] * m[u];
    h[s] = xi;
  }
  h[M] = Math.sqrt(photonDensity(h.subarray(0, M), p.delta - p.mu, p.T));
  return h;
}

/** Newton iteration on the fields from the start m0 (T > 0; also valid at T = 0). */
export function solveFields(p: CellProblem, m0: ArrayLike<number>, opts: SolveCellOptions = {}): FieldResult {
  const M = p.M, n = M + 1, tol = opts.tol ?? 1e-12, maxIter = opts.maxIter ?? 100;
  let h = fieldsOf(p, m0);
  // Seed a small photon so that the start is not confined to the uncondensed subspace.
  if (h[M] === 0) h[M] = 1e-4 / Math.max(1, p.delta - p.mu);
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
    let dir = gaussSolve(A, d, n) ? d : plain;
    let g = slope(p, cur, h, dir);
    if (!(g < 0)) { dir = plain; g = slope(p, cur, h, dir); }
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
    // A full step that no longer moves m: self-consistent (a shortened step proves nothing).
    if (step < tol && lambda === 1) { converged = true; break; }
    if (opts.abandon?.(cur.m, it)) break;
  }
  const sign = h[M] < 0 ? -1 : 1;
  return {
    m: Float64Array.from(cur.m), sx: Float64Array.from(cur.x, (x) => sign * x), xi: Float64Array.from(cur.xi),
    alpha: Math.abs(h[M]), converged, iterations: Math.min(it, maxIter), step,
  };
}

