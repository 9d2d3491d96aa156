/**
 * Phase labels of a mean-field state (DESIGN.md, table "Phase labels"):
 *
 *   condensate = alpha^2 >= condensate tol (1e-8);  modulated = max m_s - min m_s > 1e-4
 *   no condensate, unmodulated:  empty (all m_s < 1e-6), filled (all m_s > 1 - 1e-6), else normal
 *   no condensate, modulated:    density-wave, fraction p/q named
 *   condensate, unmodulated:     superradiant
 *   condensate, modulated:       supersolid, nearest fraction named
 *
 * The fraction of a modulated pattern is (# sublattices with m_s > 1/2) / M, reduced; at
 * T = 0 without a condensate it equals the filling.
 */
import type { PhaseLabel } from './state.ts';

export interface PhaseTolerances {
  /** alpha^2 at and above which the photon is condensed. */
  condensate: number;
  /** Sublattice densities differing by more than this are a modulation. */
  modulation: number;
  /** m below this is empty, above 1 - this is filled. */
  saturation: number;
}

export const DEFAULT_PHASE_TOLERANCES: Readonly<PhaseTolerances> = { condensate: 1e-8, modulation: 1e-4, saturation: 1e-6 };

/** Greatest common divisor of non-negative integers (Euclid). */
export function gcd(x: number, y: number): number {
  while (y) [x, y] = [y, x % y];
  return x;
}

/** The reduced fraction p/q as a string "p/q". */
export function fractionString(p: number, q: number): string {
  const g = gcd(p, q) || 1;
  return `${p / g}/${q / g}`;
}

/**
 * Pattern fraction (# m_s > 1/2)/M, reduced, as "p/q". When that count is 0 or M although
 * the densities are modulated (a dilute supersolid, or a thermally smeared density wave),
 * the sublattices above the midpoint (max + min)/2 are counted instead, so the pattern's
 * fraction is named rather than 0/1 or 1/1.
 */
export function patternFraction(m: ArrayLike<number>): string {
  const M = m.length;
  let p = 0, lo = Infinity, hi = -Infinity;
  for (let s = 0; s < M; s++) { if (m[s] > 0.5) p++; lo = Math.min(lo, m[s]); hi = Math.max(hi, m[s]); }
  if ((p === 0 || p === M) && hi > lo) {
    const mid = (hi + lo) / 2;
    p = 0;
    for (let s = 0; s < M; s++) if (m[s] > mid) p++;
  }
  return fractionString(p, M);
}

/** Phase label and fraction (null unless modulated) of densities m and photon density alpha^2. */
export function classifyPhase(
  m: ArrayLike<number>, photonDensity: number, tol: Partial<PhaseTolerances> = {},
): { phase: PhaseLabel; fraction: string | null } {
  const t = { ...DEFAULT_PHASE_TOLERANCES, ...tol };
  let lo = Infinity, hi = -Infinity;
  for (let s = 0; s < m.length; s++) { lo = Math.min(lo, m[s]); hi = Math.max(hi, m[s]); }
  const condensed = photonDensity >= t.condensate;
  const modulated = hi - lo > t.modulation;
  if (modulated) return { phase: condensed ? 'supersolid' : 'density-wave', fraction: patternFraction(m) };
  if (condensed) return { phase: 'superradiant', fraction: null };
  if (hi < t.saturation) return { phase: 'empty', fraction: null };
  if (lo > 1 - t.saturation) return { phase: 'filled', fraction: null };
  return { phase: 'normal', fraction: null };
}

/**
 * Best rational approximation p/q of x with q <= qMax from the continued fraction of x
 * (the last convergent or semiconvergent within the bound). Returns [p, q].
 */
export function bestRational(x: number, qMax: number): [number, number] {
  let p0 = 0, q0 = 1, p1 = 1, q1 = 0;
  let y = x;
  for (let k = 0; k < 64; k++) {
    const a = Math.floor(y);
    const p2 = a * p1 + p0, q2 = a * q1 + q0;
    if (q2 > qMax) {
      // Largest semiconvergent within the bound, if it beats the last convergent.
      const t = Math.floor((qMax - q0) / q1);
      const ps = t * p1 + p0, qs = t * q1 + q0;
      if (t >= 1 && Math.abs(x - ps / qs) < Math.abs(x - p1 / q1)) return [ps, qs];
      return [p1, q1];
    }
    p0 = p1; q0 = q1; p1 = p2; q1 = q2;
    const frac = y - a;
    if (frac < 1e-15 || Math.abs(x - p1 / q1) < 1e-15) break;
    y = 1 / frac;
  }
  return [p1, q1];
}
