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
