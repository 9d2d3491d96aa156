/**
 * Stochastic reconfiguration (Sorella, Phys. Rev. Lett. 80, 4558 (1998)): with the
 * log-derivatives O_k = d ln psi / d theta_k and the local energy E_loc,
 *
 *   S_kl = <O_k O_l> - <O_k><O_l>,   F_k = <E_loc O_k> - <E_loc><O_k>,
 *   theta <- theta - eta (S + lambda I)^-1 F,
 *
 * an imaginary-time step of length eta projected on the variational manifold
 * (dE/dtheta_k = 2 F_k). lambda = shift * mean(diag S) + floor regularises directions the
 * samples do not resolve: the floor 1e-3 (in units of O^2, O being occupation counts) freezes
 * directions whose fluctuations are below it, e.g. Jastrow shells a near-classical crystal
 * never occupies, where the noisy ratio F/S would otherwise random-walk the parameter until
 * it spoils the state (found necessary on 12-site vdw rings at alpha = 0.02). The step is
 * capped at maxStep per parameter, common practice against the noise of the first steps. Averages are weighted by the guide's w (see
 * markov-chain.ts) and merge the sums of every chain.
 */
import { CholeskyDecomposition, Matrix, solve } from 'ml-matrix';
import type { OptimiseSums } from './segment.ts';

export interface ReconfigurationStep {
  /** Parameter change delta theta. */
  delta: Float64Array;
  /** <E_loc> (total, not per site) and its naive error. */
  energy: number;
  energyError: number;
  /** <sum_i sigma^x_i> / N estimated by the flip ratios. */
  sigmaX: number;
  samples: number;
}

/** Merge chain sums and solve for the SR step. N is the number of sites. */
export function reconfigurationStep(parts: OptimiseSums[], N: number, eta: number, shift: number, maxStep = 0.5, floor = 1e-3): ReconfigurationStep {
  const P = parts[0].O.length;
  let n = 0, W = 0, W2 = 0, E = 0, E2 = 0, X = 0;
  const O = new Float64Array(P), OO = new Float64Array(P * P), EO = new Float64Array(P);
  for (const p of parts) {
    n += p.samples; W += p.W; W2 += p.W2; E += p.E; E2 += p.E2; X += p.X;
    for (let k = 0; k < P; k++) { O[k] += p.O[k]; EO[k] += p.EO[k]; }
    for (let q = 0; q < P * P; q++) OO[q] += p.OO[q];
  }
  E /= W; E2 /= W; X /= W;
  for (let k = 0; k < P; k++) { O[k] /= W; EO[k] /= W; }
  const S = new Matrix(P, P), F = new Matrix(P, 1);
  let trace = 0;
  for (let k = 0; k < P; k++) {
    F.set(k, 0, EO[k] - E * O[k]);
    for (let l = 0; l < P; l++) S.set(k, l, OO[k * P + l] / W - O[k] * O[l]);
    trace += S.get(k, k);
  }
  const lambda = shift * (trace / P) + floor;
  for (let k = 0; k < P; k++) S.set(k, k, S.get(k, k) + lambda);
  const chol = new CholeskyDecomposition(S);
  const x = chol.isPositiveDefinite() ? chol.solve(F) : solve(S, F, true);
  const delta = new Float64Array(P);
  for (let k = 0; k < P; k++) delta[k] = Math.max(-maxStep, Math.min(maxStep, -eta * x.get(k, 0)));
  // Naive error of a weighted mean: the variance over the effective sample size W^2 / W2.
  return { delta, energy: E, energyError: Math.sqrt((Math.max(0, E2 - E * E) * W2) / (W * W)), sigmaX: X / N, samples: n };
}
