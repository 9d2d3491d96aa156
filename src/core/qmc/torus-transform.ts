/**
 * The inverse transform of an even function of the torus momenta,
 *
 *   G(d) = (1/N^2) sum_k P(k) cos(k . r_d),   k . r_d = 2 pi (m1 dx / Lx + m2 dy / Ly),
 *
 * in two separable passes (O(N (Lx + Ly))). It gives the displacement couplings from V(k)
 * (V_d = N G with P = V) and the pair correlation from <|n_k|^2> (torus.ts, qmc-estimates.ts).
 */

/** G(d) = (1/N^2) sum_k P(k) cos(k . r_d) on a torus, for every displacement d. */
export function torusCorrelation(Lx: number, Ly: number, P: ArrayLike<number>): Float64Array {
  const N = Lx * Ly;
  const cx = trig(Lx, Math.cos), sx = trig(Lx, Math.sin), cy = trig(Ly, Math.cos), sy = trig(Ly, Math.sin);
  const re = new Float64Array(N), im = new Float64Array(N);
  for (let m2 = 0; m2 < Ly; m2++) {
    for (let dx = 0; dx < Lx; dx++) {
      let a = 0, b = 0;
      for (let m1 = 0; m1 < Lx; m1++) { const t = (m1 * dx) % Lx; a += P[m1 + Lx * m2] * cx[t]; b += P[m1 + Lx * m2] * sx[t]; }
      re[dx + Lx * m2] = a; im[dx + Lx * m2] = b;
    }
  }
  const G = new Float64Array(N);
  for (let dy = 0; dy < Ly; dy++) {
    for (let dx = 0; dx < Lx; dx++) {
      let a = 0;
      for (let m2 = 0; m2 < Ly; m2++) { const t = (m2 * dy) % Ly; a += re[dx + Lx * m2] * cy[t] - im[dx + Lx * m2] * sy[t]; }
      G[dx + Lx * dy] = a / (N * N);
    }
  }
  return G;
}

/** f(2 pi t / L) for t = 0..L-1. */
export function trig(L: number, f: (x: number) => number): Float64Array {
  return Float64Array.from({ length: L }, (_, t) => f((2 * Math.PI * t) / L));
}
