/**
 * The soft-core lattice sum on the chain by Poisson summation, stable at any core radius:
 *
 *   sum_n g(d + nM) = (1/M) sum_j g^(2 pi j/M) e^{2 pi i j d/M},   g(x) = V(|x|) e^{ikx},
 *
 * so with the Fourier transform V^(p) = int V(|x|) e^{-ipx} dx of V = V0/(1 + (x/Rc)^6),
 *
 *   J_st(k) = (1/M) sum_j V^(2 pi j/M - k) e^{2 pi i j d/M}  -  V0 [s = t],   d = x_t - x_s,
 *
 * the last term removing r = 0. By residues in the upper half plane (poles z_m = e^{i pi (2m+1)/6},
 * m = 0, 1, 2, where 1/(1 + z^6) has residue -z_m/6),
 *
 *   V^(p) = V0 Rc F(|p| Rc),   F(u) = -(i pi / 3) sum_m z_m e^{i u z_m},   F(0) = 2 pi / 3,
 *
 * which decays like e^{-u/2}: terms with |p| Rc > 2 * 50 are below e^{-50} of the largest and
 * are dropped. Every term is positive-weighted and of the size of the result, so there is no
 * cancellation (the split V0 Rc^6 r^-6 + remainder cancels catastrophically when Rc >> 1:
 * issue 10). Used where Rc >= POISSON_MIN_RC = 1; the sum over j has about 32 M/Rc terms.
 */

/** Core radius from which the chain's soft-core sum goes by Poisson summation. */
export const POISSON_MIN_RC = 1;

/** u = |p| Rc beyond which F(u) < e^{-50} F(0). */
const U_CUT = 100;

/** F(u) = int_{-inf}^{inf} cos(u x)/(1 + x^6) dx, u >= 0 (closed form by residues). */
export function softcoreTransform(u: number): number {
  let re = 0;
  for (let m = 0; m < 3; m++) {
    const th = (Math.PI * (2 * m + 1)) / 6;
    const zr = Math.cos(th), zi = Math.sin(th);
    // z e^{iuz} = z e^{iu zr} e^{-u zi}; -(i pi/3) times it has real part (pi/3) Im(z e^{iu zr}) e^{-u zi}.
    const damp = Math.exp(-u * zi);
    re += (Math.PI / 3) * damp * (zi * Math.cos(u * zr) + zr * Math.sin(u * zr));
  }
  return re;
}

/** Add the soft-core J_st(k) of an M-periodic chain cell into J (row-major re, im; sublattice s at x = s). */
export function softcorePoissonChain(M: number, V0: number, Rc: number, k: number, J: { re: Float64Array; im: Float64Array }): void {
  const pmax = U_CUT / Rc;
  const jlo = Math.floor(((k - pmax) * M) / (2 * Math.PI)), jhi = Math.ceil(((k + pmax) * M) / (2 * Math.PI));
  for (let j = jlo; j <= jhi; j++) {
    const p = (2 * Math.PI * j) / M - k;
    const u = Math.abs(p) * Rc;
    if (u > U_CUT) continue;
    const w = (V0 * Rc * softcoreTransform(u)) / M;
    for (let s = 0; s < M; s++) {
      for (let t = 0; t < M; t++) {
        const ph = (2 * Math.PI * j * (t - s)) / M;
        J.re[s * M + t] += w * Math.cos(ph);
        J.im[s * M + t] += w * Math.sin(ph);
      }
    }
  }
  for (let s = 0; s < M; s++) J.re[s * M + s] -= V0;
}
