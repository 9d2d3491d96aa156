/**
 * The result of a quantum Monte Carlo run as plain data, and the finite-cluster phase label
 * read from it: a condensate where the self-consistent (or fixed) alpha^2 >= 1e-8, density
 * order where the Binder cumulant of the order parameter is past the midpoint of its
 * disordered and ordered limits (a real order parameter, 2k* a reciprocal vector: 0 and
 * 2/3; a complex one: 1/3 and 2/3). On a finite cluster this is a crossover, not a
 * transition: the transition itself comes from Binder crossings over several sizes.
 */
import type { Estimate } from '../vmc/binning.ts';
import type { ChainEstimates } from './qmc-estimates.ts';
import type { AlphaMinimum, AlphaScanPoint } from './free-energy-scan.ts';

export interface QmcResult extends Omit<ChainEstimates, 'energyPerSite'> {
  method: 'qmc';
  sites: number;
  clusterKind: 'torus' | 'array';
  mu: number;
  delta: number | null;
  temperature: number | null;
  beta: number;
  /** Ground-state mode: the beta sequence and whether the energy converged. */
  ground: { betas: number[]; energies: Estimate[]; converged: boolean } | null;
  selfConsistent: boolean;
  alpha: Estimate;
  photonDensity: Estimate;
  /** <H(alpha)>/N (fixed alpha) or e = (delta - mu) alpha^2 + <H(alpha)>/N (self-consistent). */
  energyPerSite: Estimate;
  hamiltonianPerSite: Estimate;
  /** f(alpha) - f(0) on the alpha grid (self-consistent runs), and its local minima. */
  alphaScan: AlphaScanPoint[] | null;
  minima: AlphaMinimum[] | null;
  /**
   * Self-consistent runs: the detuning delta - mu below which the condensate is the global
   * minimum at this mu and T, and the alpha it jumps to there (free-energy-scan.ts).
   */
  condensateThreshold?: { deltaMinusMu: Estimate; alpha: number } | null;
  phase: 'empty' | 'filled' | 'normal' | 'density-wave' | 'superradiant' | 'supersolid';
  chains: number;
  sweeps: number;
  thermalization: number;
  notes: string[];
}

/** Finite-cluster phase label (see the header). */
export function qmcPhase(alpha: number, density: number, binder: Estimate | null, realOrder: boolean): QmcResult['phase'] {
  const condensate = alpha * alpha >= 1e-8;
  const ordered = binder !== null && Number.isFinite(binder.value) && binder.value > (realOrder ? 1 / 3 : 1 / 2);
  if (condensate) return ordered ? 'supersolid' : 'superradiant';
  if (ordered) return 'density-wave';
  if (density < 1e-3) return 'empty';
  if (density > 1 - 1e-3) return 'filled';
  return 'normal';
}
