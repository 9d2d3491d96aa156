/**
 * Check 5 of issue 8: fixed alpha on the square lattice with nearest-neighbour V1 at
 * mu = 2 V1 is the transverse-field Ising antiferromagnet, J = V1/4, h = alpha (the mapping
 * of binder-classical-ising.test.ts plus -alpha sum sigma^x). Its quantum critical point
 * (Bloete and Deng 2002) is h_c / J = 3.04438(2), so alpha_c = 3.04438 V1/4 = 0.7611 V1.
 *
 * Near a quantum critical point with z = 1 the finite-size scaling variable is the
 * distance g = alpha/alpha_c - 1 together with the aspect ratio beta / L: the Binder
 * cumulants of sizes L at a fixed aspect ratio cross at alpha_c up to corrections to
 * scaling. Here beta J = L / 2 (T = J/4 on the 8 x 8 torus, J/2 on 4 x 4): cold enough that
 * the classical thermal transition is out of reach (the ordered side stays ordered), and the
 * same ratio for both sizes. Bracket alpha_c (1 -/+ 0.15): with nu = 0.63 (3D Ising class)
 * the scaling variable |g| L^(1/nu) is 1.4 and 4.1 for L = 4 and 8, out of the crossing
 * region, where the crossing shift of such small sizes is a few percent (from memory).
 *   ordered side (alpha < alpha_c): U_8 > U_4;  disordered side: U_4 > U_8,
 * each by more than twice the combined error.
 */
import { describe, it } from 'vitest';
import { quantumMonteCarlo } from '../../../src/core/qmc/quantum-monte-carlo.ts';
import { SOURCES, expectAboveBy } from '../../references.ts';

const V1 = 1, J = V1 / 4;
/** SOURCES.bloteDeng: h_c / J = 3.04438(2). */
const alphaC = 3.04438 * J;

function binder(L: number, alpha: number) {
  const r = quantumMonteCarlo({
    cluster: { kind: 'periodic', lattice: 'square', size: [L, L], interaction: { shape: 'nn', V1 } },
    mu: 2 * V1, alpha, temperature: (2 * J) / L, sweeps: 2000, seed: 1, orderMomentum: [L / 2, L / 2],
  });
  return r.binder!;
}

describe(`fixed alpha, square lattice at mu = 2 V1: Binder crossing brackets the quantum critical point (${SOURCES.bloteDeng}; ${SOURCES.binder})`, () => {
  it(`ordered side, alpha = 0.85 alpha_c = ${(0.85 * alphaC).toFixed(4)}: U_8 > U_4 by more than 2 combined errors`, () => {
    const a = 0.85 * alphaC;
    expectAboveBy(binder(8, a), binder(4, a), 'U_8 - U_4 below alpha_c', 2);
  });
  it(`disordered side, alpha = 1.15 alpha_c = ${(1.15 * alphaC).toFixed(4)}: U_4 > U_8 by more than 2 combined errors`, () => {
    const a = 1.15 * alphaC;
    expectAboveBy(binder(4, a), binder(8, a), 'U_4 - U_8 above alpha_c', 2);
  });
});
