/**
 * The emitter Hamiltonian at a given coherent photon amplitude alpha,
 *
 *   H(alpha) = sum_i [ -mu n_i - alpha sigma^x_i ] + sum_{i<j} V_ij n_i n_j,
 *
 * in the occupation basis: diagonal E_diag(s) = -mu sum_i n_i + sum_{i<j} V_ij n_i n_j, and
 * -alpha between states differing by one flip (sigma^x flips n_i). With alpha >= 0 every
 * off-diagonal element is <= 0, so the ground state is positive (Perron-Frobenius) and
 * unique for alpha > 0. The matrix-vector product is formed on the fly, O(N D).
 */
import type { Cluster } from '../cluster/cluster.ts';
import { type Basis, indexOf, stateOf } from './basis.ts';

/** E_diag(s) for every basis state. */
export function diagonalEnergies(c: Cluster, b: Basis, mu: number): Float64Array {
  const N = c.N, V = c.V, D = b.dimension;
  const E = new Float64Array(D);
  if (b.states === null) {
    // E(s) = E(s without its highest bit h) - mu + sum_{j in rest} V_hj.
    for (let s = 1; s < D; s++) {
      const h = 31 - Math.clz32(s), rest = s ^ (1 << h);
      let e = E[rest] - mu;
      for (let r = rest; r !== 0; r &= r - 1) e += V[h * N + (31 - Math.clz32(r & -r))];
      E[s] = e;
    }
    return E;
  }
  const occ = new Int32Array(N);
  for (let k = 0; k < D; k++) {
    const s = b.states[k];
    let m = 0, e = 0;
    for (let r = s; r !== 0; r &= r - 1) occ[m++] = 31 - Math.clz32(r & -r);
    for (let a = 0; a < m; a++) {
      e -= mu;
      for (let q = 0; q < a; q++) e += V[occ[a] * N + occ[q]];
    }
    E[k] = e;
  }
  return E;
}

/** For a truncated basis: index of the state with site i flipped, or -1 if outside (N per state). */
export function flipTable(b: Basis): Int32Array | null {
  if (b.states === null) return null;
  const N = b.N, D = b.dimension, t = new Int32Array(D * N);
  for (let k = 0; k < D; k++) {
    const s = stateOf(b, k);
    for (let i = 0; i < N; i++) t[k * N + i] = indexOf(b, (s ^ (1 << i)) >>> 0);
  }
  return t;
}

/** The operator y = H(alpha) x as a closure over the diagonal (and the flip table of a truncated basis). */
export function hamiltonianProduct(b: Basis, diag: Float64Array, alpha: number, flips: Int32Array | null):
  (x: Float64Array, y: Float64Array) => void {
  const N = b.N, D = b.dimension;
  if (flips === null) {
    return (x, y) => {
      for (let s = 0; s < D; s++) {
        let off = 0;
        for (let i = 0; i < N; i++) off += x[s ^ (1 << i)];
        y[s] = diag[s] * x[s] - alpha * off;
      }
    };
  }
  return (x, y) => {
    for (let k = 0; k < D; k++) {
      let off = 0;
      const row = k * N;
      for (let i = 0; i < N; i++) { const t = flips[row + i]; if (t >= 0) off += x[t]; }
      y[k] = diag[k] * x[k] - alpha * off;
    }
  };
}
