/**
 * The diagonal energy of one occupation configuration,
 *
 *   E_diag(n) = -mu sum_i n_i + sum_{i<j} V_ij n_i n_j,
 *
 * the part of the energy estimator that does not come from operator counts. On a torus it
 * follows from the density Fourier components already measured,
 *   sum_{i != j} V_ij n_i n_j = (1/N) sum_k V~(k) |n_k|^2,   V~(k) = sum_d V_d cos(k . r_d),
 * (V_0 = 0), at O(N) given n_k; on an array it is the direct pair sum.
 *
 * Why not E0 - n/beta: with strong repulsion the shifted bond weights are ~V_ij whatever the
 * state, so the operator count fluctuates like sqrt(<n>) ~ sqrt(beta N V) and drowns the
 * energy in noise that carries no physics; E_diag - alpha <sigma^x> = E_diag - n_flip/beta
 * keeps only the state's own fluctuations (both estimate <H(alpha)>: Sandvik, Phys. Rev. E
 * 68, 056701 (2003), for the operator-count estimators).
 */
import type { QmcGeometry } from './qmc-geometry.ts';
import { torusCorrelation } from './torus-transform.ts';

/** E_diag from the occupations n and their Fourier components re, im (torus) for chemical potential mu. */
export function diagonalEnergy(g: QmcGeometry, mu: number): (n: Uint8Array, re: Float64Array, im: Float64Array) => number {
  const N = g.N;
  if (g.torus) {
    const { Lx, Ly } = g.torus;
    const Vk = torusCorrelation(Lx, Ly, g.torus.Vd);
    for (let q = 0; q < N; q++) Vk[q] *= N * N;
    return (n, re, im) => {
      let occ = 0, pair = 0;
      for (let i = 0; i < N; i++) occ += n[i];
      for (let q = 0; q < N; q++) pair += Vk[q] * (re[q] * re[q] + im[q] * im[q]);
      return -mu * occ + pair / (2 * N);
    };
  }
  const V = g.cluster!.V;
  return (n) => {
    let e = 0;
    for (let i = 0; i < N; i++) {
      if (!n[i]) continue;
      e -= mu;
      for (let j = i + 1; j < N; j++) if (n[j]) e += V[i * N + j];
    }
    return e;
  };
}
