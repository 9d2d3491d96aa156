/**
 * Static stability of a mean-field state in one k sector: the Hessian of the mean-field
 * grand potential, scaled to the form 1 - chi0(0) U(k) (DESIGN.md, "Fluctuations and soft
 * modes").
 *
 * Derivation. For a coherent photon alpha = a + ib and product states of emitters with
 * Bloch vectors S_i (|S| <= 1), the Gibbs-Bogoliubov functional per site is
 *
 *   phi = (delta-mu)(a^2 + b^2) + (1/N) sum_i [ -mu (1+S^z_i)/2 + a S^x_i - b S^y_i - T s(|S_i|) ]
 *         + (1/N) sum_{i<j} V_ij (1+S^z_i)(1+S^z_j)/4,
 *   s(r) = -((1+r)/2) ln((1+r)/2) - ((1-r)/2) ln((1-r)/2).
 *
 * Its stationary points are the mean-field equations (S = -tanh(E/T) B/|B|, photon
 * equation). Its second derivatives there: photon 2(delta-mu) for a and b; a-S^x_s 1/M and
 * b-S^y_s -1/M (per sublattice, weight 1/M); S^z_s-S^z_t J_st(k)/(4M); and the entropy term,
 * whose Hessian of f(|S|) = -T s(|S|) is f''(r) n n^T + (f'(r)/r)(1 - n n^T) with
 * f'(r) = T artanh r = E and f''(r) = T/(1 - r^2):
 *
 *   transverse (e1, e2):  h_T = E/r = E coth(E/T)   (T = 0: E),
 *   longitudinal (n):     h_L = T/(1 - r^2) = T cosh^2(E/T)   (T = 0: infinite, |S| = 1 fixed).
 *
 * These on-site stiffnesses are the inverse isothermal susceptibilities chi0 of one emitter
 * (transverse tanh(E/T)/(2E) per unit field, longitudinal sech^2(E/T)/(2T)), so scaling by
 * D = diag(2(delta-mu), h/M) gives Sigma = D^{-1/2} H D^{-1/2} = 1 + (couplings), i.e.
 * 1 - chi0 U symmetrised: eigenvalue 1 without interaction, 0 at an instability:
 *
 *   Sigma[a, (s,e)] =  e_x / sqrt(2M (delta-mu) h_e),   Sigma[b, (s,e)] = -e_y / sqrt(2M (delta-mu) h_e),
 *   Sigma[(s,e), (t,f)] = delta + J_st(k) e_z f_z / (4 sqrt(h_e h_f)).
 *
 * Longitudinal coordinates are dropped at T = 0 and where E/T > 18 (their couplings are
 * then below 1e-7 of the others: h_L > 1e15 T). The photon enters at the zone centre only.
 * In a condensate the U(1) rotation g (db = alpha, dS = -(z x S)) is an exact zero mode
 * (Goldstone); it is lifted out of the way by adding P ghat ghat^T with P above the
 * spectrum, which leaves the other eigenvalues unchanged.
 */
import type { Vec2 } from '../lattice/geometry.ts';
import { type Background, backgroundCouplings } from '../spectrum/background.ts';
import { isZoneCentre } from '../spectrum/zone.ts';

/** E/T above which the longitudinal stiffness counts as infinite. */
export const FROZEN = 18;
/** Floor of the stiffnesses (an emitter at E = 0, T = 0 is infinitely susceptible). */
const H_FLOOR = 1e-12;

/** One coordinate of the stability matrix: photon a / b, or sublattice s along a frame vector. */
export interface Coordinate {
  kind: 'a' | 'b' | 'spin';
  s: number;
  /** Frame vector (unit) for spin coordinates. */
  e: [number, number, number];
  /** On-site stiffness D (the scale of this coordinate). */
  d: number;
}

export interface StabilityMatrix {
  n: number;
  /** Hermitian, row-major. */
  re: Float64Array;
  im: Float64Array;
  coords: Coordinate[];
  photon: boolean;
  real: boolean;
}

/** The coordinates of a k sector (photon at the zone centre). */
export function coordinates(bg: Background, photon: boolean): Coordinate[] {
  const out: Coordinate[] = [];
  if (photon) {
    out.push({ kind: 'a', s: -1, e: [0, 0, 0], d: 2 * bg.dmu }, { kind: 'b', s: -1, e: [0, 0, 0], d: 2 * bg.dmu });
  }
  for (let s = 0; s < bg.M; s++) {
    const f = bg.frame, E = bg.E[s], r = bg.r[s], T = bg.T;
    // E coth(E/T) -> T (1 + x^2/3) for x = E/T -> 0 (series error x^4/45 < 1e-17 below x = 1e-4).
    const x = T > 0 ? E / T : Infinity;
    const hT = Math.max(T === 0 ? E : x < 1e-4 ? T * (1 + x * x / 3) : E / r, H_FLOOR);
    const vec = (o: number): [number, number, number] => [f[9 * s + o], f[9 * s + o + 1], f[9 * s + o + 2]];
    out.push({ kind: 'spin', s, e: vec(0), d: hT / bg.M }, { kind: 'spin', s, e: vec(3), d: hT / bg.M });
    if (T > 0 && E / T <= FROZEN) out.push({ kind: 'spin', s, e: vec(6), d: Math.max(T / (1 - r * r), H_FLOOR) / bg.M });
  }
  return out;
}

/** Sigma(k) = D^{-1/2} H(k) D^{-1/2}, with the Goldstone mode lifted in a condensate. */
export function stabilityMatrix(bg: Background, k: Vec2): StabilityMatrix {
  const centre = isZoneCentre(bg.l, bg.cell, k);
  const photon = bg.photon && centre;
  const coords = coordinates(bg, photon);
  const n = coords.length, M = bg.M;
  const J = backgroundCouplings(bg, centre ? [0, 0] : [k[0], k[1]]);
  const re = new Float64Array(n * n), im = new Float64Array(n * n);
  let real = true;
  for (let i = 0; i < n; i++) {
    const ci = coords[i];
    re[i * n + i] += 1;
    for (let j = 0; j < n; j++) {
      const cj = coords[j];
      if (ci.kind === 'spin' && cj.kind === 'spin') {
        const zz = ci.e[2] * cj.e[2];
        if (zz === 0) continue;
        const w = zz / (4 * M * Math.sqrt(ci.d * cj.d));
        re[i * n + j] += w * J.re[ci.s * M + cj.s];
        im[i * n + j] += w * J.im[ci.s * M + cj.s];
        if (J.im[ci.s * M + cj.s] !== 0 && Math.abs(J.im[ci.s * M + cj.s]) > 1e-14 * (1 + Math.abs(J.re[ci.s * M + cj.s]))) real = false;
      } else if (ci.kind !== 'spin' && cj.kind === 'spin') {
        const h = (ci.kind === 'a' ? cj.e[0] : -cj.e[1]) / (M * Math.sqrt(ci.d * cj.d));
        re[i * n + j] += h;
        re[j * n + i] += h;
      }
    }
  }
  if (photon && bg.alpha > 0) liftGoldstone(bg, coords, re, n);
  return { n, re, im, coords, photon, real: real || centre };
}

/** Add P g g^T / |g|^2 for the scaled U(1) generator g (D^{1/2} times db = alpha, dS = -(z x S)). */
function liftGoldstone(bg: Background, coords: Coordinate[], re: Float64Array, n: number): void {
  const g = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const c = coords[i];
    if (c.kind === 'b') g[i] = bg.alpha;
    else if (c.kind === 'spin') {
      const s = c.s, r = bg.r[s], nx = bg.frame[9 * s + 6], ny = bg.frame[9 * s + 7];
      // -(z x S) = (S_y, -S_x, 0) with S = r n
      g[i] = r * ny * c.e[0] - r * nx * c.e[1];
    }
    g[i] *= Math.sqrt(c.d);
  }
  let gg = 0, bound = 0;
  for (let i = 0; i < n; i++) {
    gg += g[i] * g[i];
    let row = 0;
    for (let j = 0; j < n; j++) row += Math.abs(re[i * n + j]);
    bound = Math.max(bound, row);
  }
  if (!(gg > 0)) return;
  const P = 2 * bound + 1;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) re[i * n + j] += (P * g[i] * g[j]) / gg;
}
