/**
 * Ground expectations (src/core/ed/ground-observables.ts) on product states, whose values
 * follow from single-site quantum mechanics (common practice, no source): for
 * |psi> = prod_i (cos t_i |0> + sin t_i |1>),
 *   <n_i> = sin^2 t_i,  <n_i n_j> = sin^2 t_i sin^2 t_j (i != j),  <sigma^x_i> = sin 2 t_i.
 */
import { describe, it } from 'vitest';
import { groundExpectations } from '../../../src/core/ed/ground-observables.ts';
import { blockadeBasis, fullBasis } from '../../../src/core/ed/basis.ts';
import { flipTable } from '../../../src/core/ed/hamiltonian.ts';
import { buildCluster } from '../../../src/core/cluster/spec.ts';
import { expectAbs } from '../../references.ts';

function productState(angles: number[]): Float64Array {
  const N = angles.length, psi = new Float64Array(2 ** N);
  for (let s = 0; s < psi.length; s++) {
    let a = 1;
    for (let i = 0; i < N; i++) a *= (s >> i) & 1 ? Math.sin(angles[i]) : Math.cos(angles[i]);
    psi[s] = a;
  }
  return psi;
}

describe('ground-state expectations <n_i>, <n_i n_j>, <sigma^x_i>', () => {
  it('full basis: product state values', () => {
    const t = [0.1, 0.7, 1.2, -0.4, 0.95, 0.3];
    const N = t.length, r = groundExpectations(fullBasis(N), productState(t), null);
    const n = t.map((x) => Math.sin(x) ** 2);
    // Sums of 2^6 products of order-1 terms: rounding ~1e-15, so 1e-13.
    for (let i = 0; i < N; i++) {
      expectAbs(r.density[i], n[i], 1e-13);
      expectAbs(r.sigmaX[i], Math.sin(2 * t[i]), 1e-13);
      for (let j = 0; j < N; j++) expectAbs(r.pair[i * N + j], i === j ? n[i] : n[i] * n[j], 1e-13);
    }
  });

  it('truncated basis with a flip table: the single-excitation W state', () => {
    // Blockade basis of a ring whose every pair is blockaded (V_ij >= Vb): states 0 and the
    // N one-excitation states. psi = c |0> + s/sqrt(N) sum_i |i>:
    //   <n_i> = s^2/N, <n_i n_j> = 0 (i != j), <sigma^x_i> = 2 c s/sqrt(N) (two-state algebra).
    const cluster = buildCluster({ kind: 'periodic', lattice: 'chain', size: [4], interaction: { shape: 'nn', V1: 10, V2: 10 } });
    const b = blockadeBasis(cluster, 5), N = 4;
    expectAbs(b.dimension, N + 1, 0);
    const c = Math.cos(0.6), s = Math.sin(0.6), psi = new Float64Array(b.dimension);
    psi[0] = c; // states sorted ascending: 0 first
    for (let k = 1; k <= N; k++) psi[k] = s / Math.sqrt(N);
    const r = groundExpectations(b, psi, flipTable(b));
    for (let i = 0; i < N; i++) {
      expectAbs(r.density[i], (s * s) / N, 1e-14);
      expectAbs(r.sigmaX[i], (2 * c * s) / Math.sqrt(N), 1e-14);
      for (let j = 0; j < N; j++) if (j !== i) expectAbs(r.pair[i * N + j], 0, 0);
    }
  });
});
