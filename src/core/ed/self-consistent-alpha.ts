/**
 * Self-consistent coherent photon amplitude on a finite cluster: minimise the energy per site
 *
 *   e(alpha) = (delta - mu) alpha^2 + E0(alpha)/N
 *
 * over alpha >= 0, E0(alpha) the exact ground energy of H(alpha). At an interior minimum
 * de/dalpha = 2 (delta - mu) alpha - <sum_i sigma^x_i>/N = 0 (Hellmann-Feynman), and
 * |<sigma^x_i>| <= 1 bounds the minimiser by alpha* <= 1/(2 (delta - mu)). E0 is concave in
 * alpha, so e may have more than one local minimum (a first-order jump): a grid scan of the
 * bracket picks the lowest, Brent's method refines it, and alpha = 0 is compared exactly.
 */
import { requireBelowDetuning } from '../input-error.ts';
import { boundedMinimum } from './bounded-minimum.ts';
import { type EdSystem, type GroundState, groundState } from './exact-ground-state.ts';

/** Relative energy difference below which two candidates of alpha count as tied. */
const TIE_TOL = 1e-11;

export interface SelfConsistentGround {
  ground: GroundState;
  /** e(alpha*) per site. */
  e: number;
  /** Energy evaluations (ground states) used. */
  evaluations: number;
}

/** Minimise e(alpha) on [0, 1/(2(delta - mu))]; `scan` grid intervals before refinement. */
export function selfConsistentGround(sys: EdSystem, delta: number, scan = 8): SelfConsistentGround {
  const gap = requireBelowDetuning(sys.mu, delta);
  const N = sys.cluster.N, aMax = 1 / (2 * gap);
  let warm: Float64Array | undefined;
  let evaluations = 0;
  const cache = new Map<number, GroundState>();
  const solve = (alpha: number): GroundState => {
    const hit = cache.get(alpha);
    if (hit) return hit;
    const g = groundState(sys, alpha, alpha > 0 ? warm : undefined);
    if (alpha > 0) warm = g.vector;
    evaluations++;
    cache.set(alpha, g);
    return g;
  };
  const e = (alpha: number) => gap * alpha * alpha + solve(alpha).energy / N;
  const grid = Array.from({ length: scan + 1 }, (_, i) => (aMax * i) / scan);
  const values = grid.map(e);
  let best = 0;
  for (let i = 1; i < grid.length; i++) if (values[i] < values[best]) best = i;
  const lo = grid[Math.max(0, best - 1)], hi = grid[Math.min(scan, best + 1)];
  const refined = boundedMinimum(e, lo, hi, 1e-9, 1e-12);
  // Ties go to the earlier candidate, so a normal state reports alpha = 0 exactly. A tie is
  // a difference below TIE_TOL: Lanczos energies carry rounding of ~1e-14 per site, which
  // otherwise lets Brent's alpha ~ 1e-8 (where e - e(0) ~ 1e-16) win over alpha = 0.
  const candidates = [0, grid[best], refined.x];
  let alpha = candidates[0];
  for (const c of candidates) if (e(c) < e(alpha) - TIE_TOL * Math.max(1, Math.abs(e(alpha)))) alpha = c;
  return { ground: solve(alpha), e: e(alpha), evaluations };
}
