/**
 * A followed phase's own mean-field solution (module note), checked against DESIGN.md
 * ("Sublattice mean-field at temperature T") for one sublattice, V(0) = J_00:
 *   xi = -mu + V(0) m, E = sqrt(xi^2/4 + alpha^2), m = (1 - xi tanh(E/T)/(2E))/2,
 *   (delta - mu) = tanh(E/T)/(2E) in the condensate;
 * the T = 0, V = 0 condensate onset at the lower polariton mu = delta/2 - sqrt(delta^2/4 + 1)
 * (SOURCES.hopfield); the crystal of the nn chain stable at T = 0 for 0 < mu < 2 V1 (its
 * Hartree shifts -mu and 2 V1 - mu; common practice, no source) and melted above the
 * Bragg-Williams T_c = V1/2 at half filling (SOURCES.braggWilliams).
 */
import { describe, expect, it } from 'vitest';
import { crystal, ownSolution, phaseName, uniformCondensate, uniformNormal } from '../../../src/core/softmode/own-solution.ts';
import { couplings } from '../../../src/core/interaction/lattice-sums.ts';
import { lattice } from '../../../src/core/lattice/geometry.ts';
import { period } from '../../../src/core/lattice/supercells.ts';
import { resolvePotential } from '../../../src/core/interaction/potential.ts';
import { expectAbs, expectRel } from '../../references.ts'; // citations: SOURCES in tests/references.ts

const th = (E: number, T: number) => (T === 0 ? 1 : Math.tanh(E / T));

describe('uniform condensate', () => {
  for (const [V0, mu, delta, T] of [[0, -0.2, 1, 0], [2, 0.4, 1.5, 0], [3, 0.8, 1.6, 0.3], [1, -0.1, 0.6, 0.5]]) {
    it(`V0=${V0} mu=${mu} delta=${delta} T=${T}: satisfies the DESIGN equations to 1e-10`, () => {
      const c = uniformCondensate(V0, mu, delta, T)!;
      expect(c).not.toBeNull();
      const xi = -mu + V0 * c.m, E = Math.sqrt(xi * xi / 4 + c.alpha * c.alpha);
      // 1e-10: closed form plus a bisection converged to 1e-16 relative.
      expectAbs(c.xi, xi, 1e-10);
      expectAbs(c.E, E, 1e-10);
      expectAbs(c.m, (1 - xi * th(E, T) / (2 * E)) / 2, 1e-10);
      expectAbs(th(E, T) / (2 * E), delta - mu, 1e-10);
    });
  }

  it('V = 0, T = 0: exists just above the lower polariton, not below (Hopfield 1958)', () => {
    const delta = 2, muC = delta / 2 - Math.sqrt(delta * delta / 4 + 1);
    expect(uniformCondensate(0, muC + 1e-3, delta, 0)).not.toBeNull();
    expect(uniformCondensate(0, muC - 1e-3, delta, 0)).toBeNull();
  });

  it('V = 0, T > 0: onset at (delta - mu) = tanh(|mu|/(2T))/|mu| (Hepp and Lieb 1973)', () => {
    const mu = -0.5, T = 0.3, crit = Math.tanh(0.5 / (2 * T)) / 0.5;
    expect(uniformCondensate(0, mu, mu + crit * 0.99, T)).not.toBeNull();
    expect(uniformCondensate(0, mu, mu + crit * 1.01, T)).toBeNull();
  });
});

describe('uniform normal state', () => {
  it('T = 0: m = 0, mu/V0, 1', () => {
    expect(uniformNormal(4, -1, 0)).toBe(0);
    expect(uniformNormal(4, 1, 0)).toBe(0.25);
    expect(uniformNormal(4, 5, 0)).toBe(1);
  });
  it('T > 0: m = (1 - tanh(xi/(2T)))/2, xi = -mu + V0 m (Fermi function; common practice, no source)', () => {
    for (const [V0, mu, T] of [[4, 1.3, 0.4], [2, -0.5, 0.2], [0, 0.7, 1]]) {
      const m = uniformNormal(V0, mu, T);
      // 1e-13: bisection to 1e-15 on a map of slope <= 1 + V0/(4T).
      expectAbs(m, (1 - Math.tanh((-mu + V0 * m) / (2 * T))) / 2, 1e-13);
    }
  });
});

describe('crystal of the nn chain (period 2, J_01 = 2 V1 = 8)', () => {
  const l = lattice('chain');
  const J = couplings(l, period(2), resolvePotential({ shape: 'nn', V1: 4 }, l)).re;
  it('T = 0: the pattern (1, 0) for 0 < mu < 8, null outside', () => {
    expect(Array.from(crystal(J, 2, [1, 0], 3, 0)!)).toEqual([1, 0]);
    expect(crystal(J, 2, [1, 0], -0.5, 0)).toBeNull();
    expect(crystal(J, 2, [1, 0], 8.5, 0)).toBeNull();
    expect(crystal(J, 2, [1, 0, 1], 3, 0)).toBeNull();
  });
  it('T > 0: self-consistent below T_c = V1/2 = 2, melted (null) above (Bragg-Williams)', () => {
    const T = 1.6, m = crystal(J, 2, [1, 0], 4, T)!;
    expect(m).not.toBeNull();
    for (let s = 0; s < 2; s++) {
      const xi = -4 + 8 * m[1 - s];
      expectAbs(m[s], (1 - Math.tanh(xi / (2 * T))) / 2, 1e-12);
    }
    expect(crystal(J, 2, [1, 0], 4, 2.4)).toBeNull();
  });
});

describe('ownSolution on a model point', () => {
  it('condensate and normal state of the nn chain use V(0) = 2 V1', () => {
    const point = { lattice: 'chain' as const, interaction: { shape: 'nn' as const, V1: 1.5 }, mu: 0.4, delta: 1.5, T: 0 };
    const c = ownSolution('condensate', point)!;
    const ref = uniformCondensate(3, 0.4, 1.5, 0)!;
    expectRel(c.alpha, ref.alpha, 1e-13);
    expectRel(c.densities[0], ref.m, 1e-13);
    const n = ownSolution('normal', point)!;
    expectRel(n.densities[0], 0.4 / 3, 1e-13);
    expect(n.alpha).toBe(0);
    const x = ownSolution({ cell: { a: 2, b: 0, c: 1 }, pattern: [1, 0] }, point)!;
    expect(Array.from(x.densities)).toEqual([1, 0]);
    expect(phaseName({ cell: { a: 2, b: 0, c: 1 }, pattern: [1, 0] })).toBe('crystal 2x1:1,0');
    expect(phaseName('normal')).toBe('normal');
  });
});
