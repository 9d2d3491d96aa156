/**
 * A phase's own mean-field solution at a point, followed even where it is no longer the
 * ground state (a soft-mode line is where this solution first goes unstable):
 *
 *   'condensate' - the uniform superradiant state. In closed form at any T: the photon
 *       equation tanh(E/T)/(2E) = delta - mu fixes E (T = 0: E = 1/(2(delta-mu))), then with
 *       r = tanh(E/T) the Hartree equation xi = -mu + V(0)(1 - xi r/(2E))/2 is linear:
 *       xi = (V(0)/2 - mu) / (1 + V(0) r/(4E)),  alpha^2 = E^2 - xi^2/4,
 *       m = (1 - xi r/(2E))/2. It exists where alpha^2 > 0 (one solution, no search).
 *   'normal' - the uniform state without photon (empty, filled or thermal):
 *       m = (1 - tanh(xi/(2T)))/2, xi = -mu + V(0) m, by bisection (unique for V(0) >= 0);
 *       at T = 0: m = 0 (mu < 0), 1 (mu > V(0)), else mu/V(0) (xi = 0).
 *   { cell, pattern } - a crystal of that supercell without photon: at T = 0 the integer
 *       pattern itself where it is self-consistent (xi_s < 0 exactly on the occupied
 *       sublattices); at T > 0 Newton on m = n(xi(m)) from the pattern. Null once melted
 *       (densities within 1e-4 of each other).
 */
import type { LatticeName } from '../lattice/geometry.ts';
import { supercell } from '../lattice/supercells.ts';
import type { InteractionSpec } from '../interaction/potential.ts';
import type { FluctuationInput } from '../spectrum/background.ts';
import { blochCouplings } from '../spectrum/bloch-couplings.ts';
import { lattice } from '../lattice/geometry.ts';
import { resolvePotential } from '../interaction/potential.ts';
import { gaussSolve } from '../numerics/dense-solve.ts';
import { hartreeShift } from '../meanfield/hartree-shift.ts';

export type FollowedPhase = 'condensate' | 'normal' | { cell: { a: number; b: number; c: number }; pattern: number[] };

/** Name of a followed phase for output ("condensate", "normal", "crystal 2:1,0"). */
export function phaseName(p: FollowedPhase): string {
  return typeof p === 'string' ? p : `crystal ${p.cell.a}x${p.cell.c}${p.cell.b ? '+' + p.cell.b : ''}:${p.pattern.join(',')}`;
}

export interface PointModel {
  lattice: LatticeName;
  interaction: InteractionSpec;
  mu: number;
  delta: number;
  T: number;
}

/** alpha^2 below this is no condensate (the solver's phase tolerance). */
const CONDENSATE = 1e-8;

/** The followed phase's solution at a point, as the input of a fluctuation calculation; null if it does not exist there. */
export function ownSolution(phase: FollowedPhase, p: PointModel): FluctuationInput | null {
  const l = lattice(p.lattice);
  const pot = resolvePotential(p.interaction, l);
  const cell = typeof phase === 'string' ? { a: 1, b: 0, c: 1 } : phase.cell;
  const sc = supercell(cell.a, cell.b, cell.c);
  const J = blochCouplings(l, p.interaction, pot, sc, [0, 0]).re;
  const base = { lattice: p.lattice, interaction: p.interaction, cell, mu: p.mu, delta: p.delta, T: p.T };
  if (phase === 'condensate') {
    const c = uniformCondensate(J[0], p.mu, p.delta, p.T);
    return c && { ...base, densities: [c.m], alpha: c.alpha };
  }
  if (phase === 'normal') return { ...base, densities: [uniformNormal(J[0], p.mu, p.T)], alpha: 0 };
  const m = crystal(J, sc.M, phase.pattern, p.mu, p.T);
  return m && { ...base, densities: Array.from(m), alpha: 0 };
}

/** The uniform condensate (closed form above), or null where alpha^2 <= 1e-8. */
export function uniformCondensate(V0: number, mu: number, delta: number, T: number): { m: number; alpha: number; E: number; xi: number } | null {
  const dmu = delta - mu;
  if (!(dmu > 0)) return null;
  let E: number;
  if (T === 0) E = 1 / (2 * dmu);
  else {
    if (!(dmu < 1 / (2 * T))) return null;
    let lo = 0, hi = 1 / (2 * dmu);
    for (let it = 0; it < 200 && hi - lo > 1e-16 * hi; it++) {
      const mid = (lo + hi) / 2;
      if (Math.tanh(mid / T) / (2 * mid) > dmu) lo = mid; else hi = mid;
    }
    E = (lo + hi) / 2;
  }
  const r = T === 0 ? 1 : Math.tanh(E / T);
  const den = 1 + (V0 * r) / (4 * E);
  if (!(den > 0)) return null;
  const xi = (V0 / 2 - mu) / den;
  const a2 = E * E - (xi * xi) / 4;
  if (!(a2 > CONDENSATE)) return null;
  return { m: (1 - (xi * r) / (2 * E)) / 2, alpha: Math.sqrt(a2), E, xi };
}

/** Thermal occupation of a level at xi: (1 - tanh(xi/(2T)))/2 (T = 0: step). */
function occupied(xi: number, T: number): number {
  return T === 0 ? (xi < 0 ? 1 : 0) : (1 - Math.tanh(xi / (2 * T))) / 2;
}

/** The uniform state without photon (see above). */
export function uniformNormal(V0: number, mu: number, T: number): number {
  if (T === 0) {
    if (mu <= 0) return 0;
    if (mu >= V0) return 1;
    return mu / V0;
  }
  let lo = 0, hi = 1;
  for (let it = 0; it < 200 && hi - lo > 1e-15; it++) {
    const m = (lo + hi) / 2;
    if (m - occupied(-mu + V0 * m, T) < 0) lo = m; else hi = m;
  }
  return (lo + hi) / 2;
}

/** A crystal without photon in a cell (J = J_st(0)), or null where it is not self-consistent or has melted. */
export function crystal(J: Float64Array, M: number, pattern: number[], mu: number, T: number): Float64Array | null {
  if (pattern.length !== M) return null;
  const m = Float64Array.from(pattern);
  const xiOf = (s: number) => hartreeShift(J, M, mu, m, s);
  if (T === 0) {
    for (let s = 0; s < M; s++) { const x = xiOf(s); if (m[s] === 1 ? !(x < 0) : !(x > 0)) return null; }
    return m;
  }
  const A = new Float64Array(M * M), b = new Float64Array(M);
  for (let it = 0; it < 100; it++) {
    let res = 0;
    for (let s = 0; s < M; s++) {
      const x = xiOf(s), n = occupied(x, T), d = n * (1 - n) / T;
      b[s] = n - m[s];
      res = Math.max(res, Math.abs(b[s]));
      for (let t = 0; t < M; t++) A[s * M + t] = (s === t ? 1 : 0) + d * J[s * M + t];
    }
    if (res < 1e-13) break;
    if (!gaussSolve(A, b, M)) return null;
    for (let s = 0; s < M; s++) m[s] = Math.min(1, Math.max(0, m[s] + b[s]));
  }
  let lo = Infinity, hi = -Infinity;
  for (let s = 0; s < M; s++) { lo = Math.min(lo, m[s]); hi = Math.max(hi, m[s]); }
  return hi - lo > 1e-4 ? m : null;
}
