/**
 * Fixed excitation density rho = alpha^2 + mean m (DESIGN.md): the true mean-field minimum
 * has rho(mu) non-decreasing on mu < delta, so mu is found by bracketing and a safeguarded
 * secant/bisection on rho(mu) - rho of the lowest-Omega state at each trial mu. Where rho
 * jumps (a first-order transition at mu*) and the target lies inside the jump, the system
 * phase-separates: the two states on either side of mu* coexist with lever-rule fractions
 *
 *   x_low = (rho_high - rho) / (rho_high - rho_low),  x_high = 1 - x_low,
 *
 * and the state returned is the low-density side, with `coexistence` set. mu stays below
 * delta: the upper bracket approaches delta as delta - 2^-k (rho -> infinity as mu -> delta
 * because the photon then costs nothing).
 */
import type { ModelParams } from '../model.ts';
import { InputError } from '../input-error.ts';
import type { MeanFieldState } from './state.ts';
import { context, searchCells, toState, type SearchOptions } from './cell-search.ts';
import type { SolveResult } from './ground-state.ts';

/** mu is converged when the bracket is below MU_TOL (absolute, units of g) ... */
export const MU_TOL = 1e-11;
/** ... or rho is matched to RHO_TOL. */
export const RHO_TOL = 1e-12;

/** A rho step across the closed bracket larger than this is a first-order jump. */
export const JUMP_MIN = 1e-7;

/** Solve p at fixed density p.rho for mu (see the module note); coexistence inside a jump. */
export function solveFixedDensity(p: ModelParams, o: SearchOptions = {}): SolveResult {
  const target = p.rho as number;
  const ctx = context(p);
  const at = (mu: number): MeanFieldState => toState(ctx, searchCells(ctx, mu, o), mu, o.tolerances);
  // Upper bracket: mu -> delta from below.
  let hiMu = p.delta - 1, hi = at(hiMu);
  for (let k = 0; hi.excitationDensity < target; k++) {
    if (k > 60) throw new InputError(`density ${target} not reached below mu = delta`, 'density');
    hiMu = p.delta - Math.pow(2, -k); hi = at(hiMu);
  }
  // Lower bracket: walk down geometrically until rho <= target.
  let loMu = hiMu - 1, lo = at(loMu);
  for (let k = 1; lo.excitationDensity > target; k++) {
    if (k > 60) throw new InputError(`density ${target} below the reachable minimum`, 'density');
    loMu = hiMu - Math.pow(2, k); lo = at(loMu);
  }
  if (Math.abs(lo.excitationDensity - target) <= RHO_TOL) return lo;
  if (Math.abs(hi.excitationDensity - target) <= RHO_TOL) return hi;
  // Safeguarded secant on f(mu) = rho(mu) - target with f(lo) < 0 < f(hi).
  let forceBisect = false;
  for (let it = 0; it < 200 && hiMu - loMu > MU_TOL * Math.max(1, Math.abs(hiMu)); it++) {
    const fl = lo.excitationDensity - target, fh = hi.excitationDensity - target;
    let mu = loMu - fl * (hiMu - loMu) / (fh - fl);
    const w = hiMu - loMu;
    if (forceBisect || !(mu > loMu + 0.05 * w && mu < hiMu - 0.05 * w)) mu = 0.5 * (loMu + hiMu);
    const s = at(mu);
    const f = s.excitationDensity - target;
    if (Math.abs(f) <= RHO_TOL) return s;
    const before = w;
    if (f < 0) { loMu = mu; lo = s; } else { hiMu = mu; hi = s; }
    forceBisect = hiMu - loMu > 0.5 * before;
  }
  // The bracket has closed: either on a steep but continuous rho(mu), or on a jump of rho
  // (phase coexistence).
  const rl = lo.excitationDensity, rh = hi.excitationDensity;
  if (rh - rl < JUMP_MIN) return target - rl < rh - target ? lo : hi;
  const xLow = (rh - target) / (rh - rl);
  return { ...lo, coexistence: { phases: [lo, hi], fractions: [xLow, 1 - xLow] } };
}
