/**
 * Sublattice mean-field in one supercell of M sublattices, from one start (DESIGN.md,
 * "Sublattice mean-field at temperature T"):
 *
 *   xi_s = -mu + sum_t J_st(0) m_t,   E_s = sqrt(xi_s^2/4 + alpha^2),
 *   m_s = (1 - xi_s tanh(E_s/T)/(2E_s))/2,   <sigma^x>_s = -alpha tanh(E_s/T)/E_s,
 *   (delta - mu) alpha = -(1/2M) sum_s <sigma^x>_s  (alpha = 0 when that has no root > 0),
 *   Omega = (delta-mu) alpha^2 + (1/M) sum_s [xi_s/2 - T ln 2cosh(E_s/T)]
 *           - (1/(2M)) sum_st J_st m_s m_t            (T = 0: -T ln 2cosh -> -E_s).
 *
 * Both methods minimise the mean-field free energy of a product state (so they converge to
 * minima, not saddles, and never cycle) with Newton steps and a line search: at T = 0 over
 * Bloch angles (bloch-angles.ts), at T > 0 over the trial fields (thermal-fields.ts).
 * Converged when a full step changes every m_s and <sigma^x>_s by less than tol = 1e-12.
 */
import { gOf, levelFreeEnergy, occupation } from './emitter.ts';
import { solveAngles } from './bloch-angles.ts';
import { solveFields } from './thermal-fields.ts';
import { hartreeShift } from './hartree-shift.ts';
import type { CellProblem, SolveCellOptions } from './cell-problem.ts';

export type { CellProblem, SolveCellOptions } from './cell-problem.ts';


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


/**
 * A photon amplitude below this is the rounding left of a vanishing root and is reported as
 * exactly 0 (near the onset alpha ~ sqrt(mu - mu_c), so this resolves mu_c to ~1e-26).
 */
export const ALPHA_ZERO = 1e-13;

/**
 * Temperatures below this are solved as T = 0. The thermal Newton matrix holds 1/T^3
 * (emitter.ts, qOf), which overflows for T < 1e-103 and has lost every digit long before;
 * at T = 1e-12 g the thermal weight e^{-2E/T} of any level with E > 2.5e-11 g is below
 * e^{-50}, below double rounding, so the T = 0 equations give
 * the same state to rounding except for levels closer than ~1e-11 g to degeneracy.
 */
export const T_GROUND = 1e-12;

/**
 * Solve the sublattice equations of one cell from the start m0 (values in [0, 1]).
 * A run that stops at its iteration cap, or where the line search can no longer descend,
 * still counts as converged when its state satisfies the mean-field equations to
 * CHECK_TOL: at a marginal point (a quartic minimum, e.g. where
 * the filled state meets the condensate at (delta - mu) mu = 1) Newton converges only
 * linearly and alpha ~ 1e-7 is all the rounding of Omega ~ alpha^4 can resolve; under a
 * strong blockade (V ~ 1e18) the last step is below the rounding of Omega.
 */
export function solveCell(p0: CellProblem, m0: ArrayLike<number>, opts: SolveCellOptions = {}): CellSolution {
  const p = p0.T > 0 && p0.T < T_GROUND ? { ...p0, T: 0 } : p0;
  const r = p.T === 0 ? solveAngles(p, m0, opts) : solveFields(p, m0, opts);
  if (r.alpha < ALPHA_ZERO) { r.alpha = 0; r.sx.fill(0); }
  if (r.converged && !selfConsistent(p, r.m, r.alpha)) r.converged = false;
  else if (!r.converged && !opts.abandon?.(r.m, r.iterations) && selfConsistent(p, r.m, r.alpha)) r.converged = true;
  return { m: r.m, sx: r.sx, alpha: r.alpha, omega: grandPotential(p, r.m, r.xi, r.alpha), converged: r.converged, iterations: r.iterations, step: r.step };
}

/** Residual allowed in the final check of the mean-field equations (rounding amplified by J). */
const CHECK_TOL = 1e-9;

/**
 * Final guard against a false convergence: the state must satisfy the equations as written
 * in DESIGN.md, m_s = (1 - xi_s tanh(E_s/T)/(2E_s))/2 with xi from m (to CHECK_TOL in m, and
 * in the Hartree field those m produce, to CHECK_TOL (1 + |xi|)), and for alpha > 0 the
 * photon equation (delta - mu) = mean tanh(E_s/T)/(2E_s), to CHECK_TOL.
 */
function selfConsistent(p: CellProblem, m: Float64Array, alpha: number): boolean {
  const { M, J, mu, T } = p;
  const a = alpha * alpha;
  let G = 0;
  const occ = new Float64Array(M);
  for (let s = 0; s < M; s++) {
    const xi = hartreeShift(J, M, mu, m, s);
    const E = Math.sqrt(xi * xi / 4 + a);
    // E = 0 (xi = 0, no photon) is a regular half-filled level at T > 0; at T = 0 it is degenerate.
    if (E === 0 && T === 0) return false;
    const g = gOf(E, T);
    G += g / M;
    occ[s] = occupation(xi, a, E, g, T);
    if (!(Math.abs(occ[s] - m[s]) <= CHECK_TOL)) return false;
  }
  // And in energy: under a strong blockade m ~ 1e-13 passes the test above while J m is 1e33
  // away from the field that m itself sees; the fields of m and of its occupations must agree.
  for (let s = 0; s < M; s++) {
    const xi = hartreeShift(J, M, mu, m, s), xiOcc = hartreeShift(J, M, mu, occ, s);
    if (!(Math.abs(xiOcc - xi) <= CHECK_TOL * (1 + Math.abs(xi)))) return false;
  }
  return alpha === 0 || Math.abs(G - (p.delta - mu)) <= CHECK_TOL * (p.delta - mu);
}

/**
 * Omega per site of a state (DESIGN.md formula) from its m_s, Hartree shifts xi_s and alpha:
 * (delta-mu) alpha^2 + mean[xi/2 - T ln 2cosh(E/T)] - (1/2M) sum m_s (xi_s + mu).
 */
export function grandPotential(p: CellProblem, m: ArrayLike<number>, xi: ArrayLike<number>, alpha: number): number {
  const { M, mu, T } = p;
  const a = alpha * alpha;
  let local = 0, hartree = 0;
  for (let s = 0; s < M; s++) {
    local += xi[s] / 2 + levelFreeEnergy(Math.sqrt(xi[s] * xi[s] / 4 + a), T);
    hartree += m[s] * (xi[s] + mu);
  }
  return (p.delta - mu) * a + local / M - hartree / (2 * M);
}
