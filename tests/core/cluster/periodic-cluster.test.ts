import { describe, it, expect } from 'vitest';
import { periodicCluster } from '../../../src/core/cluster/periodic-cluster.ts';
import { buildCluster, parseClusterSize } from '../../../src/core/cluster/spec.ts';
import { lattice, position } from '../../../src/core/lattice/geometry.ts';
import { InputError } from '../../../src/core/input-error.ts';
import { expectRel } from '../../references.ts';

/**
 * V_0j of a ring of L sites, V = C/r^6 over all images, summed directly in the test:
 * sum_{m} |j + m L|^-6 for |m| <= 20000 plus the integral tail 2 * (1/L) int_{M L}^inf r^-6 dr,
 * whose own error is below (M L)^-7, far under 1e-14 relative.
 */
function ringImageSum(L: number, j: number, C: number): number {
  const M = 20000;
  let s = 0;
  for (let m = -M; m <= M; m++) { const r = Math.abs(j + m * L); if (r > 0) s += r ** -6; }
  return C * (s + (2 * (M * L) ** -5) / (5 * L));
}

describe('periodic clusters: V_ij summed over all images, no self-image', () => {
  it('nn ring: V1 between ring neighbours, zero elsewhere and on the diagonal (closed form)', () => {
    const c = periodicCluster('chain', 6, 1, { shape: 'nn', V1: 1.3 });
    for (let i = 0; i < 6; i++) {
      for (let j = 0; j < 6; j++) {
        const d = Math.min(Math.abs(i - j), 6 - Math.abs(i - j));
        // exact arithmetic: only the literal V1 enters.
        expect(c.V[i * 6 + j]).toBe(d === 1 ? 1.3 : 0);
        expect(c.distance[i * 6 + j]).toBeCloseTo(d, 12);
      }
    }
  });

  it('vdw ring: V_0j equals the direct image sum (computed in the test) to 1e-12', () => {
    const Rb = 1.5, C = 2 * Rb ** 6, L = 8;
    const c = periodicCluster('chain', L, 1, { shape: 'vdw', Rb });
    // tolerance 1e-12: the Ewald sum is exact to rounding; the direct sum above to ~1e-15.
    for (let j = 1; j < L; j++) expectRel(c.V[j], ringImageSum(L, j, C), 1e-12);
  });

  it('square 4x4 vdw: row sum = V(k=0) of the lattice minus the self-image sum (invariant)', () => {
    const l = lattice('square'), Lx = 4, Ly = 4, C = 2;
    const c = periodicCluster('square', Lx, Ly, { shape: 'vdw', V1: C });
    // sum_j V_0j = sum_{r != 0} C/r^6 - sum_{R != 0 superlattice} C/R^6. The second sum directly
    // over |m|,|n| <= 400 (tail below (1600)^-4 relative); the first as 4 zeta(3) beta(3)
    // (Glasser and Zucker; see lattice-sums tests), beta(3) = pi^3/32, zeta(3) summed here.
    let zeta3 = 0;
    for (let n = 1; n < 200000; n++) zeta3 += n ** -3;
    zeta3 += 1 / (2 * 200000 ** 2);
    const full = C * 4 * zeta3 * (Math.PI ** 3 / 32);
    let self = 0;
    for (let m = -400; m <= 400; m++) for (let n = -400; n <= 400; n++) {
      if (m === 0 && n === 0) continue;
      const [x, y] = position(l, m * Lx, n * Ly);
      self += C / (x * x + y * y) ** 3;
    }
    let row = 0;
    for (let j = 0; j < 16; j++) row += c.V[j];
    // tolerance 1e-9: zeta(3) partial sum + tail is good to ~1e-15, the self sum tail ~1e-11 relative.
    expectRel(row, full - self, 1e-9);
  });

  it('triangular 3x3 nn: six distinct neighbours of V1, translation invariant and symmetric', () => {
    const c = periodicCluster('triangular', 3, 3, { shape: 'nn', V1: 1 });
    const N = 9;
    for (let i = 0; i < N; i++) {
      let row = 0, count = 0;
      for (let j = 0; j < N; j++) {
        row += c.V[i * N + j];
        if (c.V[i * N + j] !== 0) count++;
        expect(c.V[i * N + j]).toBe(c.V[j * N + i]);
      }
      // coordination 6 of the triangular lattice (exact).
      expect(row).toBe(6);
      expect(count).toBe(6);
    }
  });

  it('cluster momenta: k = 2 pi m / L on a ring, folded into (-pi, pi]', () => {
    const c = periodicCluster('chain', 6, 1, { shape: 'nn', V1: 1 });
    const ks = Array.from({ length: 6 }, (_, q) => c.momenta[2 * q]).sort((a, b) => a - b);
    const expected = [-2, -1, 0, 1, 2, 3].map((m) => (2 * Math.PI * m) / 6);
    ks.forEach((k, q) => expect(k).toBeCloseTo(expected[q], 14));
  });

  it('sizes: parse "12" and "4x4", refuse bad sizes with InputError', () => {
    expect(parseClusterSize('12')).toEqual([12]);
    expect(parseClusterSize('4x3')).toEqual([4, 3]);
    expect(() => parseClusterSize('4x')).toThrow(InputError);
    expect(() => parseClusterSize('a')).toThrow(/size must be/);
    const spec = (size: number[], lat: 'chain' | 'square' = 'chain') => ({ kind: 'periodic' as const, lattice: lat, size, interaction: { shape: 'nn' as const, V1: 1 } });
    expect(() => buildCluster(spec([1]))).toThrow(/>= 2/);
    expect(() => buildCluster(spec([4, 4]))).toThrow(/one size L/);
    expect(() => buildCluster(spec([4], 'square'))).toThrow(/Lx x Ly/);
    expect(() => buildCluster(spec([40, 40], 'square'))).toThrow(/limit/);
  });
});
