/**
 * Invariants of the mean-field ground state (common practice, no source):
 *  - variational: the chosen Omega is the lowest over every converged start of every cell,
 *    and no product state at all (random Bloch vectors, photon at its optimum) has a lower
 *    mean-field free energy
 *      F = (delta-mu) alpha^2 + alpha mean x - mu mean m + (1/2M) m.J.m - T mean S(r),
 *    S(r) = -[(1+r)/2 ln((1+r)/2) + (1-r)/2 ln((1-r)/2)], m = (1+z)/2, Bloch vector (x, z);
 *  - thermodynamic: rho = -dOmega/dmu (Hellmann-Feynman) and rho(mu) never decreases;
 *  - fixed density round-trips fixed mu; inside a first-order jump the two coexisting
 *    phases reproduce the target density by the lever rule and have equal Omega at mu*.
 */
import { describe, expect, it } from 'vitest';
import seedrandom from 'seedrandom';
import { solveGroundState } from '../../../src/core/meanfield/ground-state.ts';
import { cellCandidates, context } from '../../../src/core/meanfield/cell-search.ts';
import { solveCell } from '../../../src/core/meanfield/sublattice.ts';
import { MU_TOL, RHO_TOL } from '../../../src/core/meanfield/fixed-density.ts';
import { couplings } from '../../../src/core/interaction/lattice-sums.ts';
import { lattice } from '../../../src/core/lattice/geometry.ts';
import { resolvePotential } from '../../../src/core/interaction/potential.ts';
import type { ModelParams } from '../../../src/core/model.ts';

const chain = (mu: number, T: number, extra: Partial<ModelParams> = {}): ModelParams => ({
  lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.4 }, delta: 2, T, mu, maxCell: 8, ...extra,
});
const square = (mu: number, T: number): ModelParams => ({
  lattice: 'square', interaction: { shape: 'nn', V1: 3 }, delta: 3, T, mu, maxCell: 4,
});

/** Mean-field free energy per site of an arbitrary product state (see the header). */
function productFreeEnergy(p: ModelParams, J: Float64Array, x: number[], z: number[]): number {
  const M = x.length, mu = p.mu as number, dmu = p.delta - mu;
  const m = z.map((v) => (1 + v) / 2);
  const xMean = x.reduce((a, b) => a + b, 0) / M;
  const alpha = -xMean / (2 * dmu);
  let e = dmu * alpha * alpha + alpha * xMean;
  for (let s = 0; s < M; s++) {
    e += -mu * m[s] / M;
    for (let t = 0; t < M; t++) e += J[s * M + t] * m[s] * m[t] / (2 * M);
    if (p.T > 0) {
      const r = Math.hypot(x[s], z[s]);
      const S = -[(1 + r) / 2, (1 - r) / 2].reduce((a, q) => a + (q > 0 ? q * Math.log(q) : 0), 0);
      e -= p.T * S / M;
    }
  }
  return e;
}

const cases: [string, ModelParams[]][] = [
  ['chain T = 0', [-1, 0, 0.5, 1, 1.5].map((mu) => chain(mu, 0))],
  ['chain T = 0.1', [-1, 0, 0.5, 1.5].map((mu) => chain(mu, 0.1))],
  ['square T = 0', [-0.5, 0.5, 2, 2.9].map((mu) => square(mu, 0))],
];

describe('variational invariants', () => {
  for (const [name, ps] of cases) {
    it(`${name}: lowest Omega over all converged starts, random starts and random product states`, () => {
      const rng = seedrandom(`invariants ${name}`);
      for (const p of ps) {
        const s = solveGroundState(p);
        const ctx = context(p);
        const l = lattice(p.lattice), pot = resolvePotential(p.interaction, l);
        // 1e-12 relative: the Omegas of converged states are exact to rounding.
        const slack = 1e-12 * Math.max(1, Math.abs(s.grandPotential));
        for (const cell of ctx.cells) {
          for (const c of cellCandidates(ctx, cell, p.mu as number, { seed: 7, randomStarts: 3 })) {
            expect(c.sol.omega).toBeGreaterThanOrEqual(s.grandPotential - slack);
          }
          const J = couplings(l, cell, pot).re;
          for (let k = 0; k < 5; k++) {
            const m0 = Array.from({ length: cell.M }, () => rng());
            const sol = solveCell({ M: cell.M, J, mu: p.mu as number, delta: p.delta, T: p.T }, m0);
            if (sol.converged) expect(sol.omega).toBeGreaterThanOrEqual(s.grandPotential - slack);
            // A random product state, not solved at all: T = 0 pure (r = 1), T > 0 mixed.
            const th = Array.from({ length: cell.M }, () => Math.PI * rng());
            const r = Array.from({ length: cell.M }, () => (p.T > 0 ? rng() : 1));
            const x = th.map((t, i) => -r[i] * Math.sin(t)), z = th.map((t, i) => -r[i] * Math.cos(t));
            expect(productFreeEnergy(p, J, x, z)).toBeGreaterThanOrEqual(s.grandPotential - slack);
          }
        }
      }
    });
  }
});

describe('thermodynamic invariants', () => {
  it('rho(mu) never decreases and equals -dOmega/dmu', () => {
    for (const T of [0, 0.1]) {
      let last = -Infinity;
      let guess;
      for (let i = 0; i < 120; i++) {
        const mu = -2 + (3.9 * i) / 120;
        const s = solveGroundState(chain(mu, T), { guess });
        guess = s;
        // 1e-11: densities of converged states are exact to ~1e-12.
        expect(s.excitationDensity, `T ${T} mu ${mu}`).toBeGreaterThanOrEqual(last - 1e-11);
        last = s.excitationDensity;
      }
      for (const mu of [-0.8, 0.3, 1.2]) {
        const h = 1e-5;
        const d = -(solveGroundState(chain(mu + h, T)).grandPotential - solveGroundState(chain(mu - h, T)).grandPotential) / (2 * h);
        // Central difference: error h^2 Omega'''/6 plus rounding 1e-16/h; 1e-6 covers both
        // unless a transition lies within h (none at these points).
        expect(Math.abs(d - solveGroundState(chain(mu, T)).excitationDensity)).toBeLessThan(1e-6);
      }
    }
  });
});

describe('fixed density', () => {
  it('round-trips fixed mu in compressible states', () => {
    for (const [mu, T] of [[-0.3, 0], [0.8, 0], [-0.3, 0.1], [0.4, 0.1], [1.6, 0]]) {
      const s = solveGroundState(chain(mu, T));
      const h = 1e-4;
      const kappa = (solveGroundState(chain(mu + h, T)).excitationDensity - solveGroundState(chain(mu - h, T)).excitationDensity) / (2 * h);
      expect(kappa).toBeGreaterThan(1e-3); // compressible, so mu(rho) is unique
      const back = solveGroundState({ ...chain(0, T), mu: undefined, rho: s.excitationDensity });
      expect(back.coexistence ?? null).toBeNull();
      // Root finder: |rho - target| <= RHO_TOL or a mu bracket of MU_TOL; through the
      // compressibility kappa = drho/dmu (measured) that is a mu error of RHO_TOL/kappa.
      expect(Math.abs(back.mu - mu)).toBeLessThanOrEqual(2 * RHO_TOL / kappa + MU_TOL * (1 + Math.abs(mu)));
      expect(Math.abs(back.excitationDensity - s.excitationDensity)).toBeLessThanOrEqual(RHO_TOL + kappa * MU_TOL * (1 + Math.abs(mu)));
    }
  });

  it('inside a first-order jump reports coexistence with lever-rule fractions', () => {
    // Classical-limit chain (delta = 1e3): rho jumps between neighbouring plateaus.
    const p = (rho: number): ModelParams => ({
      lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 1e3, T: 0, rho, maxCell: 12,
    });
    for (const rho of [0.45, 0.61, 0.31]) { // inside the jumps 4/9-5/11, 3/5-5/8, 3/10-1/3
      const s = solveGroundState(p(rho));
      expect(s.coexistence).toBeTruthy();
      const { phases: [lo, hi], fractions: [xl, xh] } = s.coexistence!;
      expect(lo.excitationDensity).toBeLessThan(rho);
      expect(hi.excitationDensity).toBeGreaterThan(rho);
      expect(xl).toBeGreaterThan(0);
      expect(xh).toBeGreaterThan(0);
      expect(Math.abs(xl + xh - 1)).toBeLessThan(1e-15);
      // Lever rule to rounding (1e-12).
      expect(Math.abs(xl * lo.excitationDensity + xh * hi.excitationDensity - rho)).toBeLessThan(1e-12);
      // Both at the transition: mu within the bracket, Omega equal to (rho jump) x bracket.
      expect(Math.abs(hi.mu - lo.mu)).toBeLessThanOrEqual(MU_TOL * (1 + Math.abs(lo.mu)));
      expect(Math.abs(hi.grandPotential - lo.grandPotential)).toBeLessThanOrEqual(2 * MU_TOL * (1 + Math.abs(lo.mu)));
    }
  });
});
