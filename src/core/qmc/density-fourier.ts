/**
 * Density Fourier components of one occupation configuration on the run's momenta,
 *
 *   n_k = sum_i n_i exp(-i k . r_i),
 *
 * separably on a torus (two passes of 1D transforms, O(N (Lx + Ly))) and directly on an
 * array (O(N N_k)), from cosine and sine tables built once.
 */
import type { QmcGeometry } from './qmc-geometry.ts';
import { trig } from './torus-transform.ts';

export interface DensityFourier {
  /** Number of momenta. */
  readonly K: number;
  /** Operations of one transform (with the pair sums of an array), to space the measurements. */
  readonly work: number;
  /** Write Re n_k, Im n_k of occupations n into re, im (length K). */
  readonly transform: (n: Uint8Array, re: Float64Array, im: Float64Array) => void;
}

/** Tables for the geometry's momenta. */
export function densityFourier(g: QmcGeometry): DensityFourier {
  if (g.torus) {
    const { Lx, Ly } = g.torus;
    const cx = trig(Lx, Math.cos), sx = trig(Lx, Math.sin), cy = trig(Ly, Math.cos), sy = trig(Ly, Math.sin);
    const rowRe = new Float64Array(Lx * Ly), rowIm = new Float64Array(Lx * Ly);
    return {
      K: Lx * Ly, work: Lx * Ly * (Lx + Ly),
      transform: (n, re, im) => {
        rowRe.fill(0); rowIm.fill(0);
        for (let y = 0; y < Ly; y++) {
          for (let x = 0; x < Lx; x++) {
            if (!n[x + Lx * y]) continue;
            for (let m1 = 0; m1 < Lx; m1++) {
              const t = (m1 * x) % Lx;
              rowRe[m1 + Lx * y] += cx[t]; rowIm[m1 + Lx * y] -= sx[t];
            }
          }
        }
        for (let m2 = 0; m2 < Ly; m2++) {
          for (let m1 = 0; m1 < Lx; m1++) {
            let a = 0, b = 0;
            for (let y = 0; y < Ly; y++) {
              const t = (m2 * y) % Ly, ar = rowRe[m1 + Lx * y], ai = rowIm[m1 + Lx * y];
              // (ar + i ai)(cos - i sin)
              a += ar * cy[t] + ai * sy[t]; b += ai * cy[t] - ar * sy[t];
            }
            re[m1 + Lx * m2] = a; im[m1 + Lx * m2] = b;
          }
        }
      },
    };
  }
  const N = g.N, K = g.momenta.length / 2;
  const c = new Float64Array(K * N), s = new Float64Array(K * N);
  for (let q = 0; q < K; q++) {
    for (let i = 0; i < N; i++) {
      const ph = g.momenta[2 * q] * g.positions[2 * i] + g.momenta[2 * q + 1] * g.positions[2 * i + 1];
      c[q * N + i] = Math.cos(ph); s[q * N + i] = Math.sin(ph);
    }
  }
  return {
    K, work: N * K + N * N,
    transform: (n, re, im) => {
      for (let q = 0; q < K; q++) {
        let a = 0, b = 0;
        for (let i = 0; i < N; i++) if (n[i]) { a += c[q * N + i]; b -= s[q * N + i]; }
        re[q] = a; im[q] = b;
      }
    },
  };
}
