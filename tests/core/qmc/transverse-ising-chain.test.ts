/**
 * Check 2 of issue 8: the nearest-neighbour chain at mu = V1 is the transverse-field Ising
 * chain. With n = (1 + sigma^z)/2 on a ring,
 *   -mu sum n_i + V1 sum n_i n_(i+1) - alpha sum sigma^x_i
 *     = (V1/4) sum sigma^z_i sigma^z_(i+1) - alpha sum sigma^x_i - N V1/4      (mu = V1),
 * so J = V1/4, h = alpha and a constant -V1/4 per site; the same mapping makes <n> = 1/2
 * exactly (sigma^z -> -sigma^z). Energy and <sigma^x> at finite T from the free-fermion
 * integral (transverse-ising-free-fermions.ts), computed in the test.
 *
 * The integral is the infinite chain; the Monte Carlo runs a ring of L = 64. At T > 0 every
 * connected correlation decays with a finite correlation length xi(T), and the free energy
 * per site of a ring differs from the infinite chain's by O(exp(-L/xi)). Here xi is a few
 * sites: at h = 0 the classical chain has xi = 1/ln coth(J/T) = 3.7 sites at T = J, and the
 * transverse field shortens it; at the critical field h = J, xi ~ v/T with v = 2J (the
 * slope of Lambda_k), about 5 sites at T = 0.4 J. So exp(-L/xi) < 1e-5, far below the error
 * bars (~2e-3), and the comparison needs no finite-size allowance.
 */
import { describe, expect, it } from 'vitest';
import { quantumMonteCarlo } from '../../../src/core/qmc/quantum-monte-carlo.ts';
import { SOURCES, expectAbs, expectWithinSigmas } from '../../references.ts';
import { transverseIsingChain } from './transverse-ising-free-fermions.ts';

const V1 = 1, J = V1 / 4, L = 64;
const ring = { kind: 'periodic' as const, lattice: 'chain' as const, size: [L], interaction: { shape: 'nn' as const, V1 } };

describe(`nn chain at mu = V1 against the free-fermion integral (${SOURCES.pfeutyFreeEnergy}; ${SOURCES.liebSchultzMattis})`, () => {
  it('the quadrature reproduces its own limits and derivatives', () => {
    // h = 0: the classical Ising chain, f = -T ln(2 cosh(J/T)) (Ising 1925, textbook);
    // J = 0: free spins, f = -T ln(2 cosh(h/T)). Exact arithmetic: 1e-12.
    expectAbs(transverseIsingChain(J, 0, 0.3).f, -0.3 * Math.log(2 * Math.cosh(J / 0.3)), 1e-12);
    expectAbs(transverseIsingChain(0, 0.4, 0.3).f, -0.3 * Math.log(2 * Math.cosh(0.4 / 0.3)), 1e-12);
    // e = f - T df/dT and <sigma^x> = -df/dh by central differences (step 1e-4: error ~1e-8).
    for (const [h, T] of [[0.1, 0.25], [0.25, 0.1], [0.5, 0.25]]) {
      const d = 1e-4, x = transverseIsingChain(J, h, T);
      const dfdT = (transverseIsingChain(J, h, T + d).f - transverseIsingChain(J, h, T - d).f) / (2 * d);
      const dfdh = (transverseIsingChain(J, h + d, T).f - transverseIsingChain(J, h - d, T).f) / (2 * d);
      expectAbs(x.e, x.f - T * dfdT, 1e-7);
      expectAbs(x.sigmaX, -dfdh, 1e-7);
    }
  });

  // Ordered side (h < J), paramagnetic side (h > J) at T = J, and the critical field at T = 0.4 J.
  const points = [
    { alpha: 0.1, T: 0.25 },
    { alpha: 0.5, T: 0.25 },
    { alpha: 0.25, T: 0.1 },
  ];
  for (const { alpha, T } of points) {
    it(`ring of ${L} at alpha = ${alpha}, T = ${T}: energy, <sigma^x>, <n> = 1/2 within 4 sigma`, () => {
      const r = quantumMonteCarlo({ cluster: ring, mu: V1, alpha, temperature: T, sweeps: 4000, seed: 1 });
      const exact = transverseIsingChain(J, alpha, T);
      // Source: the free-fermion integral above; constant -V1/4 per site from the mapping.
      // maxError 0.005: about 1% of the energy and sigma^x scales, so the check is sharp.
      expectWithinSigmas(r.energyPerSite, exact.e - V1 / 4, `energy per site (exact ${exact.e - V1 / 4})`, { maxError: 0.005 });
      expectWithinSigmas(r.sigmaX, exact.sigmaX, `<sigma^x> (exact ${exact.sigmaX})`, { maxError: 0.005 });
      // Particle-hole symmetry of the mapping: <n> = 1/2 exactly.
      expectWithinSigmas(r.density, 0.5, '<n>', { maxError: 0.005 });
      expect(r.notes.some((n) => n.includes('drifts'))).toBe(false);
    });
  }
});
