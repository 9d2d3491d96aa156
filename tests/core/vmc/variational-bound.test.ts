/**
 * The variational principle: the VMC energy of any wavefunction is >= the exact ground
 * energy on the same cluster, E_vmc >= E_ed - 3 sigma (3 sigma: statistics only). And the
 * Jastrow form is close at these points, within 1% of ED; they are chosen to span the regimes
 * the method is used in:
 *  - the blockaded vdw ring of the command-line example (Rb = 1.5, mu = 1.5, alpha = 0.3),
 *    a fluctuating near-crystal where nearest-neighbour blockade dominates;
 *  - a nearly classical crystal (mu = 3, alpha = 0.02), where |psi|^2 alone would be
 *    under-sampled (the guided chain's case);
 *  - a short-range nn ring deep in the transverse field (mu = 0.5, alpha = 0.5), a liquid of
 *    excitations with short correlations, the Jastrow factor's home ground;
 *  - a 4x4 square torus with a cut vdw tail (rmax = 2), the 2D case;
 *  - a self-consistent point (delta = 2), where alpha is optimised alongside.
 */
import { describe, it, expect } from 'vitest';
import { exactDiagonalisation, type EdRequest } from '../../../src/core/ed/exact-diagonalisation.ts';
import { variationalMonteCarlo } from '../../../src/core/vmc/variational-monte-carlo.ts';

const chain = (interaction: object) => ({ kind: 'periodic' as const, lattice: 'chain' as const, size: [12], interaction: interaction as never });
const points: [string, EdRequest][] = [
  ['vdw ring, CLI example', { cluster: chain({ shape: 'vdw', Rb: 1.5 }), mu: 1.5, alpha: 0.3 }],
  ['vdw ring, near-classical crystal', { cluster: chain({ shape: 'vdw', Rb: 1.5 }), mu: 3, alpha: 0.02 }],
  ['nn ring, strong field', { cluster: chain({ shape: 'nn', V1: 1 }), mu: 0.5, alpha: 0.5 }],
  ['square 4x4, vdw cut at 2', { cluster: { kind: 'periodic', lattice: 'square', size: [4, 4], interaction: { shape: 'vdw', Rb: 1.2, rmax: 2 } }, mu: 1, alpha: 0.4 }],
  ['vdw ring, self-consistent alpha', { cluster: chain({ shape: 'vdw', Rb: 1.2 }), mu: 1, delta: 2 }],
];

describe('VMC variational bound against ED on the same cluster', () => {
  for (const [name, req] of points) {
    it(`${name}: E_ed - 3 sigma <= E_vmc <= E_ed + 1% |E_ed|`, async () => {
      const ed = exactDiagonalisation(req);
      const vmc = variationalMonteCarlo({ ...req, seed: 7, chains: 2 });
      const e = vmc.energyPerSite;
      expect(e.error).toBeGreaterThan(0);
      expect(e.value).toBeGreaterThanOrEqual(ed.energyPerSite - 3 * e.error);
      expect(e.value - ed.energyPerSite).toBeLessThanOrEqual(0.01 * Math.abs(ed.energyPerSite));
      expect(vmc.trace.length).toBe(200);
    });
  }
});
