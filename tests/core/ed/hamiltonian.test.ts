/**
 * The emitter Hamiltonian (src/core/ed/hamiltonian.ts) against a dense matrix built here from
 * the model's definition (README.md, "H(alpha) = ..."), H = sum_i [-mu n_i - alpha sigma^x_i] + sum_{i<j} V_ij n_i n_j,
 * with n_i = bit i of the state and sigma^x_i flipping that bit; the couplings V_ij are the
 * cluster's input data. Symmetry x.Hy = y.Hx is common practice, no source.
 */
import { describe, it, expect } from 'vitest';
import seedrandom from 'seedrandom';
import { diagonalEnergies, flipTable, hamiltonianProduct } from '../../../src/core/ed/hamiltonian.ts';
import { blockadeBasis, fullBasis, stateOf } from '../../../src/core/ed/basis.ts';
import { buildCluster } from '../../../src/core/cluster/spec.ts';
import { expectAbs } from '../../references.ts';

/** Dense H on the listed states (row-major), from the definition. */
function denseH(N: number, V: Float64Array, mu: number, alpha: number, states: number[]): Float64Array {
  const D = states.length, H = new Float64Array(D * D);
  const index = new Map(states.map((s, k) => [s, k]));
  for (let k = 0; k < D; k++) {
    const s = states[k];
    let e = 0;
    for (let i = 0; i < N; i++) {
      if (!((s >> i) & 1)) continue;
      e -= mu;
      for (let j = i + 1; j < N; j++) if ((s >> j) & 1) e += V[i * N + j];
    }
    H[k * D + k] = e;
    for (let i = 0; i < N; i++) {
      const t = index.get(s ^ (1 << i));
      if (t !== undefined) H[k * D + t] -= alpha;
    }
  }
  return H;
}

function randomVector(D: number, rng: () => number): Float64Array {
  return Float64Array.from({ length: D }, () => 2 * rng() - 1);
}

const dot = (p: Float64Array, q: Float64Array) => p.reduce((s, x, i) => s + x * q[i], 0);

describe('emitter Hamiltonian H(alpha) in the occupation basis', () => {
  const cluster = buildCluster({ kind: 'periodic', lattice: 'chain', size: [7], interaction: { shape: 'vdw', V1: 3.7 } });
  const N = cluster.N, mu = 0.45, alpha = 0.83, rng = seedrandom('hamiltonian');

  it('full basis: H x matches the dense definition and x.Hy = y.Hx', () => {
    const b = fullBasis(N), D = b.dimension;
    const states = Array.from({ length: D }, (_, k) => k);
    const H = denseH(N, cluster.V, mu, alpha, states);
    const apply = hamiltonianProduct(b, diagonalEnergies(cluster, b, mu), alpha, flipTable(b));
    for (let trial = 0; trial < 3; trial++) {
      const x = randomVector(D, rng), y = randomVector(D, rng), Hx = new Float64Array(D), Hy = new Float64Array(D);
      apply(x, Hx); apply(y, Hy);
      // Sums of at most N + 1 terms of size <= ~10: rounding ~1e-14, so 1e-12.
      for (let k = 0; k < D; k++) {
        let ref = 0;
        for (let t = 0; t < D; t++) ref += H[k * D + t] * x[t];
        expectAbs(Hx[k], ref, 1e-12);
      }
      // D = 128 terms: 1e-11.
      expectAbs(dot(x, Hy), dot(y, Hx), 1e-11);
    }
  });

  it('blockade-truncated basis: H x is the dense definition restricted to the kept states', () => {
    const b = blockadeBasis(cluster, 2), D = b.dimension;
    expect(D).toBeLessThan(2 ** N);
    const states = Array.from({ length: D }, (_, k) => stateOf(b, k));
    // Every kept state has no excited pair with V_ij >= 2 (the basis's definition).
    for (const s of states) for (let i = 0; i < N; i++) for (let j = i + 1; j < N; j++) {
      if ((s >> i) & 1 && (s >> j) & 1) expect(cluster.V[i * N + j]).toBeLessThan(2);
    }
    const H = denseH(N, cluster.V, mu, alpha, states);
    const apply = hamiltonianProduct(b, diagonalEnergies(cluster, b, mu), alpha, flipTable(b));
    const x = randomVector(D, rng), y = randomVector(D, rng), Hx = new Float64Array(D), Hy = new Float64Array(D);
    apply(x, Hx); apply(y, Hy);
    for (let k = 0; k < D; k++) {
      let ref = 0;
      for (let t = 0; t < D; t++) ref += H[k * D + t] * x[t];
      expectAbs(Hx[k], ref, 1e-12);
    }
    expectAbs(dot(x, Hy), dot(y, Hx), 1e-11);
  });
});
