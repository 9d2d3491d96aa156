/**
 * Expectation values in a ground vector psi (real, normalised) of the occupation basis:
 *
 *   <n_i>       = sum_s psi_s^2 n_i(s)
 *   <n_i n_j>   = sum_s psi_s^2 n_i(s) n_j(s)
 *   <sigma^x_i> = sum_s psi_s psi_{s with i flipped}
 *
 * The pair sum runs over the occupied sites of each state, O(D n^2) for n excitations.
 */
import { type Basis, stateOf } from './basis.ts';

export interface GroundExpectations {
  /** <n_i>. */
  density: Float64Array;
  /** <n_i n_j> at [i*N + j], diagonal <n_i>. */
  pair: Float64Array;
  /** <sigma^x_i>. */
  sigmaX: Float64Array;
}

/** <n_i>, <n_i n_j>, <sigma^x_i> of psi; `flips` is the flip table of a truncated basis (null for full). */
export function groundExpectations(b: Basis, psi: Float64Array, flips: Int32Array | null): GroundExpectations {
  const N = b.N, D = b.dimension;
  const density = new Float64Array(N), pair = new Float64Array(N * N), sigmaX = new Float64Array(N);
  const occ = new Int32Array(N);
  for (let k = 0; k < D; k++) {
    const w = psi[k] * psi[k];
    const s = stateOf(b, k);
    if (w !== 0 && s !== 0) {
      let m = 0;
      for (let r = s; r !== 0; r &= r - 1) occ[m++] = 31 - Math.clz32(r & -r);
      for (let a = 0; a < m; a++) {
        const row = occ[a] * N;
        for (let q = 0; q <= a; q++) pair[row + occ[q]] += w;
      }
    }
    for (let i = 0; i < N; i++) {
      const t = flips === null ? s ^ (1 << i) : flips[k * N + i];
      if (t >= 0) sigmaX[i] += psi[k] * psi[t];
    }
  }
  for (let i = 0; i < N; i++) {
    density[i] = pair[i * N + i];
    for (let j = 0; j < i; j++) pair[j * N + i] = pair[i * N + j];
  }
  return { density, pair, sigmaX };
}
