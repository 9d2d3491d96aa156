/**
 * Citations and tolerance helpers shared by the reference tests. Each test names the
 * source of its check value beside it; the full citations are collected here (journal
 * references written from memory; the closed forms are recomputed in the tests).
 */
import { expect } from 'vitest';

export const SOURCES = {
  riemannZeta6: 'Riemann zeta(6) = pi^6/945 (Euler; Abramowitz and Stegun, Handbook of Mathematical Functions, 23.2.16)',
  squareLatticeSum: 'sum\' (m^2+n^2)^-s = 4 zeta(s) beta(s) (Glasser and Zucker, in Theoretical Chemistry: Advances and Perspectives 5, 67 (1980); Zucker, J. Phys. A 7, 1568 (1974))',
  triangularLatticeSum: 'sum\' (m^2+mn+n^2)^-s = 6 zeta(s) L_-3(s) (Zucker and Robertson, J. Phys. A 8, 874 (1975))',
  hopfield: 'Hopfield, Phys. Rev. 112, 1555 (1958): lower polariton energy delta/2 - sqrt(delta^2/4 + g^2)',
  heppLieb: 'Hepp and Lieb, Ann. Phys. 76, 360 (1973); Wang and Hioe, Phys. Rev. A 7, 831 (1973)',
  filledLobe: 'common practice, no source: the filled state needs (delta - mu) mu > 1, possible only for delta > 2',
  wignerLattice: 'Hubbard, Phys. Rev. B 17, 494 (1978); Pokrovsky and Uimin, J. Phys. C 11, 3535 (1978)',
  bakBruinsma: 'Bak and Bruinsma, Phys. Rev. Lett. 49, 249 (1982)',
  pfeuty: 'Pfeuty, Annals of Physics 57, 79 (1970)',
  sorella: 'Sorella, Phys. Rev. Lett. 80, 4558 (1998)',
  stinchcombe: 'Stinchcombe, J. Phys. C 6, 2459 (1973): RPA (linear spin-wave) modes of the transverse Ising model, paramagnet omega_k^2 = 4h(h + J(k)/2) in sigma units (from memory)',
  braggWilliams: 'mean-field lattice gas (Bragg-Williams): instability where 1 + V(k) m(1-m)/T = 0, T_c = z J_Ising (textbook, e.g. Chaikin and Lubensky, Principles of Condensed Matter Physics (1995), ch. 4; from memory)',
  liebSchultzMattis: 'Lieb, Schultz and Mattis, Ann. Phys. 16, 407 (1961): the Jordan-Wigner free-fermion solution of the transverse-field Ising chain',
  pfeutyFreeEnergy: 'Pfeuty, Annals of Physics 57, 79 (1970): transverse-field Ising chain free energy f = -(T/pi) int_0^pi ln(2 cosh(Lambda_k/2T)) dk, Lambda_k = 2 sqrt(J^2 + h^2 - 2 J h cos k) (Pauli matrices)',
  onsager: 'Onsager, Phys. Rev. 65, 117 (1944): square-lattice Ising T_c = 2 J / ln(1 + sqrt 2) (J of sigma sigma)',
  bloteDeng: 'Bloete and Deng, Phys. Rev. E 66, 066110 (2002): square-lattice transverse-field Ising critical point h_c / J = 3.04438(2)',
  binder: 'Binder, Z. Phys. B 43, 119 (1981): U_L = 1 - <m^4>/(3 <m^2>^2) is size-independent at a critical point, so curves of two sizes cross there',
  fullSpectrumEd: 'exact diagonalisation in the test: the full spectrum of the 2^N basis by ml-matrix EigenvalueDecomposition (tred2/tql2), thermal averages summed over every eigenstate',
  wilkinsonReinsch: 'Wilkinson and Reinsch, Handbook for Automatic Computation II: Linear Algebra (Springer 1971): hqr2 (src/core/numerics, translated from ml-matrix with an iteration cap), tred2/tql2 (via ml-matrix)',
} as const;

/** |actual - expected| <= rel * |expected| (plus a tiny absolute floor for zeros). */
export function expectRel(actual: number, expected: number, rel: number, floor = 1e-300): void {
  const err = Math.abs(actual - expected);
  const tol = rel * Math.abs(expected) + floor;
  if (!(err <= tol)) {
    expect.fail(`expected ${actual} to equal ${expected} within ${rel} relative (error ${err})`);
  }
}

/** |actual - expected| <= abs. */
export function expectAbs(actual: number, expected: number, abs: number): void {
  const err = Math.abs(actual - expected);
  if (!(err <= abs)) expect.fail(`expected ${actual} to equal ${expected} within ${abs} (error ${err})`);
}

/**
 * Tolerance of a Monte Carlo estimate against an exact value: 4 standard errors. With the
 * seeds fixed every run is deterministic, but the seed is arbitrary, so the tolerance must
 * hold for almost any seed: a Gaussian error leaves 4 sigma with probability 6e-5, so
 * even a hundred such comparisons fail for correct code with a chance below 1%, while any
 * bias of several error bars still fails.
 */
export const MC_SIGMAS = 4;

/** A Monte Carlo value with its error bar. */
export interface McEstimate {
  value: number;
  error: number;
}

/**
 * |est - expected| <= MC_SIGMAS est.error + extra, where `extra` is a deterministic
 * allowance the caller names (grid resolution, a bounded finite-size term). `maxError`
 * keeps the check sharp: an error bar larger than it fails (a run too short to test).
 */
export function expectWithinSigmas(
  est: McEstimate, expected: number, what: string, opts: { maxError?: number; extra?: number; sigmas?: number } = {},
): void {
  const sigmas = opts.sigmas ?? MC_SIGMAS, extra = opts.extra ?? 0;
  if (!Number.isFinite(est.value) || !Number.isFinite(est.error)) expect.fail(`${what}: not finite (${est.value} +- ${est.error})`);
  const dev = Math.abs(est.value - expected), tol = sigmas * est.error + extra;
  if (!(dev <= tol)) {
    expect.fail(`${what}: ${est.value} +- ${est.error} vs ${expected}: off by ${(dev / est.error).toFixed(1)} sigma (allowed ${sigmas} sigma + ${extra})`);
  }
  if (opts.maxError !== undefined && !(est.error <= opts.maxError)) {
    expect.fail(`${what}: error bar ${est.error} above ${opts.maxError}, too large for a sharp check`);
  }
}

/** a - b > k * (combined error of a and b), the errors independent. */
export function expectAboveBy(a: McEstimate, b: McEstimate, what: string, k = 1): void {
  const combined = Math.hypot(a.error, b.error);
  if (!(a.value - b.value > k * combined)) {
    expect.fail(`${what}: ${a.value} +- ${a.error} is not above ${b.value} +- ${b.error} by ${k} combined errors (${combined})`);
  }
}

/**
 * The grid part of the tolerance of a self-consistent alpha. The Monte Carlo takes the root
 * of D(alpha) = 2 (delta - mu) alpha - <sigma^x>(alpha) by linear interpolation between two
 * points of its alpha grid (free-energy-scan.ts). Even with the exact <sigma^x>, that
 * interpolation between the grid points that bracket the exact root misses it by the amount
 * returned (the curvature of <sigma^x> over one grid step), which the statistical error does
 * not contain. `grid` is the run's grid (its alphaScan), `dmu` = delta - mu; a root outside
 * the grid gets the largest spacing.
 */
export function gridAllowance(grid: readonly number[], dmu: number, sigmaX: (alpha: number) => number, exactRoot: number): number {
  const g = [...grid].sort((x, y) => x - y);
  const k = g.findIndex((a, i) => i + 1 < g.length && a <= exactRoot && exactRoot <= g[i + 1]);
  if (k < 0) return Math.max(...g.slice(1).map((a, i) => a - g[i]));
  const a = g[k], b = g[k + 1];
  const Da = 2 * dmu * a - sigmaX(a), Db = 2 * dmu * b - sigmaX(b);
  return Math.abs(a + ((b - a) * -Da) / (Db - Da) - exactRoot);
}
