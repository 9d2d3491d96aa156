/**
 * The mean-field ground state of the model (DESIGN.md, "Sublattice mean-field at
 * temperature T"): the lowest grand potential per site over all supercells up to Mmax
 * (or exactly p.cell), at fixed mu or at fixed density rho (p.rho: mu solved for, with
 * phase coexistence inside a first-order jump of rho(mu)). Input is validated first
 * (InputError on bad input, mu >= delta refused).
 */
import { validateModel, type ModelParams } from '../model.ts';
import type { SolveResult } from './state.ts';
import { context, searchCells, toState, type SearchOptions } from './cell-search.ts';
import { solveFixedDensity } from './fixed-density.ts';

export type { SolveResult } from './state.ts';

export type GroundStateOptions = SearchOptions;

/**
 * Solve the model p. Deterministic for given p and seed; `guess` (a neighbouring point's
 * state) is tried as an extra start, never instead of the others.
 */
export function solveGroundState(p: ModelParams, opts: GroundStateOptions = {}): SolveResult {
  validateModel(p);
  if (p.rho !== undefined) return solveFixedDensity(p, opts);
  const ctx = context(p);
  const mu = p.mu as number;
  return toState(ctx, searchCells(ctx, mu, opts), mu, opts.tolerances);
}
