/**
 * Fixed excitation density rho = alpha^2 + mean m (DESIGN.md): the true mean-field minimum
 * has rho(mu) non-decreasing on mu < delta, so mu is found by bracketing and a regula
 * falsi (Illinois) with bisection on rho(mu) - rho of the lowest-Omega state at each trial
 * mu. Where rho jumps (a first-order transition at mu*) and the target lies inside the jump,
 * the system
 * phase-separates: the two states on either side of mu* coexist with lever-rule fractions
 *
 *   x_low = (rho_high - rho) / (rho_high - rho_low),  x_high = 1 - x_low,
 *
 * and the state returned is the low-density side, with `coexistence` set. mu stays below
 * delta: the upper bracket approaches delta as delta - (1 + |delta|) 2^-k (rho -> infinity
 * as mu -> delta because the photon then costs nothing). Converged when |rho - target| <=
 * RHO_TOL or the mu bracket is below MU_TOL (relative to max(1, |mu|)).
 */
import type { ModelParams } from '../model.ts';
import { InputError } from '../input-error.ts';
import { ConvergenceError } from '../convergence-error.ts';
import type { MeanFieldState, SolveResult } from './state.ts';
import { context, searchCells, toState, type SearchOptions } from './cell-search.ts';

/** mu is converged when the bracket is below MU_TOL (absolute, units of g) ... */
export const MU_TOL = 1e-11;
/** ... or rho is matched to RHO_TOL. */
export const RHO_TOL = 1e-12;

/** A continuous rho(mu) whose closed bracket still misses the target by more than this (1 + rho) is refused. */
export const STEEP_TOL = 1e-6;

/** A rho step across the closed bracket below JUMP_MIN (1 + rho) is never called a jump. */
export const JUMP_MIN = 1e-9;

/** Solve p at fixed density p.rho for mu (see the module note); coexistence inside a jump. */
export function solveFixedDensity(p: ModelParams, o: SearchOptions = {}): SolveResult {
  const target = p.rho as number;
  const all = context(p), sizes = o.cellSizes;
  const ctx = sizes ? { ...all, cells: all.cells.filter((c) => sizes.includes(c.M)) } : all;
  // Each trial is a full search; the nearer bracket state is passed on as an extra start.
  const at = (mu: number, guess?: MeanFieldState): MeanFieldState =>
    toState(ctx, searchCells(ctx, mu, { ...o, guess: guess ?? o.guess }), mu, o.tolerances);
  // Upper bracket: mu -> delta from below, delta - (1 + |delta|) 2^-k.
  let hiMu = p.delta - 1, hi = at(hiMu);
  for (let k = 1; hi.excitationDensity < target; k++) {
    const mu = p.delta - (1 + Math.abs(p.delta)) * Math.pow(2, -k);
    if (!(mu < p.delta) || k > 200) throw new InputError(`density ${target} is not reached below mu = delta`, 'density');
    hiMu = mu; hi = at(hiMu, hi);
  }
  // Lower bracket: walk down geometrically until rho <= target.
  let loMu = hiMu - 1, lo = at(loMu);
  for (let k = 1; lo.excitationDensity > target; k++) {
    if (k > 60) throw new InputError(`density ${target} below the reachable minimum`, 'density');
    loMu = hiMu - Math.pow(2, k); lo = at(loMu, lo);
  }
  if (Math.abs(lo.excitationDensity - target) <= RHO_TOL) return lo;
  if (Math.abs(hi.excitationDensity - target) <= RHO_TOL) return hi;
  // Illinois-modified regula falsi on f(mu) = rho(mu) - target, f(lo) < 0 < f(hi): the
  // end kept twice in a row has its f halved, which restores superlinear convergence; a
  // bisection whenever the bracket fails to halve in two steps bounds the cost on jumps.
  let fl = lo.excitationDensity - target, fh = hi.excitationDensity - target;
  let side = 0, slow = 0;
  for (let it = 0; it < 300 && hiMu - loMu > MU_TOL * Math.max(1, Math.abs(hiMu)); it++) {
    const w = hiMu - loMu;
    let mu = loMu - fl * w / (fh - fl);
    if (slow >= 2 || !(mu > loMu && mu < hiMu)) { mu = 0.5 * (loMu + hiMu); slow = 0; }
    const s = at(mu, mu - loMu < hiMu - mu ? lo : hi);
    const f = s.excitationDensity - target;
    if (Math.abs(f) <= RHO_TOL) return s;
    if (f < 0) {
      loMu = mu; lo = s; fl = f;
      if (side === -1) fh /= 2;
      side = -1;
    } else {
      hiMu = mu; hi = s; fh = f;
      if (side === 1) fl /= 2;
      side = 1;
    }
    slow = hiMu - loMu > 0.5 * w ? slow + 1 : 0;
  }
  // The bracket has closed: on a steep but continuous rho(mu), or on a jump of rho (phase
  // coexistence). A jump is a step far above what the compressibility just outside the
  // bracket accounts for over its width.
  const rl = lo.excitationDensity, rh = hi.excitationDensity;
  const w = 1e-7 * Math.max(1, Math.abs(hiMu)), width = hiMu - loMu;
  const outMu = hiMu + w < p.delta ? hiMu + w : loMu - w;
  const out = at(outMu, outMu > hiMu ? hi : lo);
  const kappa = Math.abs(out.excitationDensity - (outMu > hiMu ? rh : rl)) / w;
  if (rh - rl <= Math.max(JUMP_MIN * (1 + target), 100 * kappa * width)) {
    const near = target - rl < rh - target ? lo : hi;
    // A continuous rho(mu) too steep for the resolution of mu (e.g. T >> g, where the
    // condensate appears within 1/(2T) of delta): say so rather than return another density.
    if (Math.abs(near.excitationDensity - target) > STEEP_TOL * (1 + target)) {
      throw new ConvergenceError('fixed density', `rho(mu) rises from ${rl} to ${rh} within mu = ${loMu}..${hiMu}, finer than mu resolves; density ${target} not reached`);
    }
    return near;
  }
  const xLow = (rh - target) / (rh - rl);
  return { ...lo, coexistence: { phases: [lo, hi], fractions: [xLow, 1 - xLow] } };
}
