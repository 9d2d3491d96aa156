import { describe, it, expect } from 'vitest';
import { exactDiagonalisation } from '../../../src/core/ed/exact-diagonalisation.ts';
import { blockadeBasis, fullBasis } from '../../../src/core/ed/basis.ts';
import { buildCluster } from '../../../src/core/cluster/spec.ts';
import { InputError } from '../../../src/core/input-error.ts';

const ring = (L: number, interaction: object = { shape: 'nn', V1: 1 }) =>
  ({ kind: 'periodic' as const, lattice: 'chain' as const, size: [L], interaction: interaction as never });

describe('exact diagonalisation refuses what it cannot do', () => {
  it('N > 20 on the full basis, with the memory it would need', () => {
    expect(() => fullBasis(21)).toThrow(InputError);
    expect(() => exactDiagonalisation({ cluster: ring(24), mu: 1, alpha: 0.1 })).toThrow(/N <= 20.*2\^24.*GiB/);
    expect(() => exactDiagonalisation({ cluster: { kind: 'periodic', lattice: 'square', size: [5, 5], interaction: { shape: 'nn', V1: 1 } }, mu: 1, alpha: 0.1 })).toThrow(/N = 25/);
  });

  it('alpha < 0, neither alpha nor detuning, mu >= delta', () => {
    expect(() => exactDiagonalisation({ cluster: ring(4), mu: 1, alpha: -0.1 })).toThrow(/alpha must be >= 0/);
    expect(() => exactDiagonalisation({ cluster: ring(4), mu: 1 })).toThrow(/give alpha/);
    expect(() => exactDiagonalisation({ cluster: ring(4), mu: 1, delta: 1 })).toThrow(/photon number is unbounded/);
    expect(() => exactDiagonalisation({ cluster: ring(4), mu: NaN, alpha: 0.1 })).toThrow(InputError);
  });

  it('blockade basis: bad threshold refused; a 24-site ring fits (independent sets of a cycle = Lucas numbers)', () => {
    expect(() => exactDiagonalisation({ cluster: ring(6), mu: 1, alpha: 0.1, blockade: -1 })).toThrow(/blockade threshold/);
    // Number of independent vertex sets of the cycle C_L is the Lucas number L_L = phi^L + (-phi)^-L
    // (standard combinatorics, e.g. Prodinger and Tichy, Fibonacci Quarterly 20, 16 (1982), from memory).
    const phi = (1 + Math.sqrt(5)) / 2;
    const b = blockadeBasis(buildCluster(ring(24)), 1);
    expect(b.dimension).toBe(Math.round(phi ** 24 + (-phi) ** -24));
    const r = exactDiagonalisation({ cluster: ring(24, { shape: 'nn', V1: 1 }), mu: 0.5, alpha: 0.3, blockade: 1 });
    expect(r.sites).toBe(24);
    expect(r.density).toBeLessThanOrEqual(0.5); // no two neighbours excited
    expect(() => blockadeBasis(buildCluster(ring(32)), 1)).toThrow(/N <= 30/);
  });
});
