/**
 * The trial product state of the finite-T solver and its Gibbs-Bogoliubov free energy.
 * Emitter s sits in the trial field h_s = zeta_s n + beta sigma^x at temperature T, so
 * m_s = (1 - zeta_s g_s)/2, x_s = <sigma^x>_s = -2 beta g_s with g = tanh(E/T)/(2E),
 * E^2 = zeta^2/4 + beta^2, and
 *
 *   Phi(h) = (1/M) sum_s [-T S_s] + e(m, x),
 *   e = -mu mean m + (1/2M) m.J.m - (mean x)^2 / (4 (delta - mu))   (photon eliminated),
 *
 * with -T S_s = F0_s - zeta_s m_s - beta x_s, F0_s = zeta_s/2 - T ln 2cosh(E_s/T). Its
 * gradient is (1/M) chi r, r = H(h) - h the residual of the mean-field map H = (xi(m),
 * alpha(x)), chi = d(m, x)/d(zeta, beta) (Bogoliubov's inequality; e.g. Feynman,
 * Statistical Mechanics (1972), ch. 2).
 */
import { gOf, qOf, occupation, levelFreeEnergy } from './emitter.ts';
import { levenbergFactor, softestDirection } from '../numerics/negative-curvature.ts';
import type { CellProblem } from './cell-problem.ts';
import { hartreeShift } from './hartree-shift.ts';

/** The trial state of fields h: occupations m, coherences x, their derivatives, Phi. */
export interface Trial {
  m: Float64Array; x: Float64Array;
  cmz: Float64Array; cmb: Float64Array; cxb: Float64Array;
  /** Hartree fields xi(m) and the photon alpha(x). */
  xi: Float64Array; alpha: number;
  phi: number;
}

/** Zeroed work arrays for the trial state of an M-sublattice cell. */
export function newTrial(M: number): Trial {
  const f = () => new Float64Array(M);
  return { m: f(), x: f(), cmz: f(), cmb: f(), cxb: f(), xi: f(), alpha: 0, phi: 0 };
}

/** Evaluate the trial state of fields h into t (and, if `deriv`, chi). */
export function evaluate(p: CellProblem, h: Float64Array, t: Trial, deriv: boolean): void {
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
    const xi = hartreeShift(J, M, mu, t.m, s);
    t.xi[s] = xi;
    e += t.m[s] * (xi - mu); // m (J m) - 2 mu m, halved below
  }
  const xMean = xSum / M;
  t.alpha = -xMean / (2 * dmu);
  t.phi = entropyTerm / M + e / (2 * M) - (xMean * xMean) / (4 * dmu);
}

/** Directional derivative of Phi along d: (1/M) sum_s r_s . chi_s . d_s (beta shared). */
export function slope(p: CellProblem, t: Trial, h: Float64Array, d: Float64Array): number {
  const M = p.M, rb = t.alpha - h[M], db = d[M];
  let s = 0;
  for (let i = 0; i < M; i++) {
    const rz = t.xi[i] - h[i];
    s += rz * (t.cmz[i] * d[i] + t.cmb[i] * db) + rb * (t.cmb[i] * d[i] + t.cxb[i] * db);
  }
  return s / M;
}

/** Gradient of Phi at the evaluated trial t of fields h: (1/M) chi r, beta shared. */
export function gradient(p: CellProblem, t: Trial, h: Float64Array, out: Float64Array): void {
  const M = p.M, rb = t.alpha - h[M];
  let gb = 0;
  for (let s = 0; s < M; s++) {
    const rz = t.xi[s] - h[s];
    out[s] = (rz * t.cmz[s] + rb * t.cmb[s]) / M;
    gb += rz * t.cmb[s] + rb * t.cxb[s];
  }
  out[M] = gb / M;
}

/**
 * Negative curvature of Phi at h, for leaving a saddle (a nearly symmetric state that is
 * unstable towards modulation or condensation, which the Newton and plain steps leave only
 * slowly). The Hessian is the central difference of the analytic gradient (steps 1e-6 of
 * the field scale; only its sign structure and softest direction are used). Returns the
 * downhill-signed direction of most negative curvature (inverse iteration with the shifted
 * Cholesky factor), or null when the Hessian is positive definite.
 */
export function negativeCurvature(p: CellProblem, h: Float64Array, cur: Trial, work: Trial): Float64Array | null {
  const n = p.M + 1;
  const H = new Float64Array(n * n), L = new Float64Array(n * n);
  const gp = new Float64Array(n), gm = new Float64Array(n), hh = Float64Array.from(h);
  let scale = p.T;
  for (let i = 0; i < n; i++) scale = Math.max(scale, Math.abs(h[i]));
  for (let j = 0; j < n; j++) {
    const e = 1e-6 * (Math.abs(h[j]) + p.T);
    hh[j] = h[j] + e; evaluate(p, hh, work, true); gradient(p, work, hh, gp);
    hh[j] = h[j] - e; evaluate(p, hh, work, true); gradient(p, work, hh, gm);
    hh[j] = h[j];
    for (let i = 0; i < n; i++) H[i * n + j] = (gp[i] - gm[i]) / (2 * e);
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) { const v = (H[i * n + j] + H[j * n + i]) / 2; H[i * n + j] = v; H[j * n + i] = v; }
  }
  if (levenbergFactor(H, n, L) === 0) return null;
  gradient(p, cur, h, gp);
  const v = softestDirection(L, n, gp, 8, new Float64Array(n));
  let curv = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) curv += v[i] * H[i * n + j] * v[j];
  if (!(curv < 0)) return null;
  for (let i = 0; i < n; i++) v[i] *= 0.1 * scale;
  return v;
}

