import { describe, it, expect } from 'vitest';
import { supercellsOfSize, sublatticeOf, supercell, reciprocalSuperlattice, superlatticeVectors } from '../../../src/core/lattice/supercells.ts';
import { lattice } from '../../../src/core/lattice/geometry.ts';

/** sigma(M) = sum of the divisors of M: the number of index-M sublattices of Z^2 (common practice, no source). */
const sigma = (M: number) => { let s = 0; for (let d = 1; d <= M; d++) if (M % d === 0) s += d; return s; };

describe('supercells by Hermite normal form', () => {
  it('enumerates sigma(M) distinct superlattices of each index', () => {
    for (let M = 1; M <= 12; M++) {
      const cells = supercellsOfSize(2, M);
      expect(cells.length).toBe(sigma(M));
      // distinct: the sets of superlattice points in a window differ
      const keys = new Set(cells.map((c) => {
        const pts: string[] = [];
        for (let j = -13; j <= 13; j++) for (let i = -13; i <= 13; i++) if (sublatticeOf(c, i, j) === 0) pts.push(`${i},${j}`);
        return pts.join(';');
      }));
      expect(keys.size).toBe(cells.length);
    }
    expect(supercellsOfSize(1, 7).length).toBe(1);
  });

  it('sublatticeOf is invariant under superlattice translations and hits every sublattice once per cell', () => {
    const c = supercell(3, 1, 2);
    for (let j = -4; j <= 4; j++) for (let i = -5; i <= 5; i++) {
      const s = sublatticeOf(c, i, j);
      expect(sublatticeOf(c, i + c.a, j)).toBe(s);
      expect(sublatticeOf(c, i + c.b, j + c.c)).toBe(s);
    }
    const seen = new Set<number>();
    for (let s = 0; s < c.M; s++) seen.add(sublatticeOf(c, c.sites[2 * s], c.sites[2 * s + 1]));
    expect(seen.size).toBe(c.M);
  });

  it('reciprocal superlattice satisfies A_i . B_j = 2 pi delta_ij', () => {
    const l = lattice('triangular'), c = supercell(2, 1, 3);
    const A = superlatticeVectors(l, c), B = reciprocalSuperlattice(l, c);
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) {
      const dot = A[i][0] * B[j][0] + A[i][1] * B[j][1];
      expect(Math.abs(dot - (i === j ? 2 * Math.PI : 0))).toBeLessThan(1e-12);
    }
  });
});
