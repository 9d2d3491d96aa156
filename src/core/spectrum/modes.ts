/**
 * Normal modes at one crystal momentum from the eigenvalues lambda of the linear map
 * (linearised.ts), with the convention x(t) ~ e^{lambda t}:
 *
 *   - a mode of the wave e^{ik.r} with positive frequency omega has lambda = -i omega;
 *     lambda = +i omega belongs to the wave at -k (its complex conjugate), so the branches at
 *     k are omega = -Im lambda over the eigenvalues with Im lambda < 0; at the zone centre the
 *     map is real and its eigenvalues come as the pairs +-i omega of the real linear map;
 *   - eigenvalues with |Im lambda| at rounding level (zero modes: the Goldstone mode of a
 *     condensate, or a purely growing pair +-gamma) count half each, as omega = 0;
 *   - Re lambda > 0 anywhere is a dynamical instability: `growth` = max Re lambda.
 *
 * Tolerance: the Goldstone mode is a 2 x 2 Jordan block, split by rounding into
 * +-sqrt(eps |A|) ~ 1e-8 |A|; eigenvalues within ZERO = 1e-6 (relative to the largest) of
 * the axes are treated as on them.
 */
import type { Vec2 } from '../lattice/geometry.ts';
import type { Background } from './background.ts';
import { dynamicalMatrix } from './linearised.ts';
import { complexEigenvalues, realEigen } from './complex-eigen.ts';

export const ZERO = 1e-6;

export interface ModesAt {
  /** Positive branches at k, ascending (zero modes as 0). */
  omega: number[];
  /** Largest Re lambda (0 within rounding: dynamically stable). */
  growth: number;
  /** Photon weight of each branch (only at the zone centre with the photon; else absent). */
  photonWeight?: number[];
}

/** Branches at k. With `weights`, also each branch's photon weight (zone centre only). */
export function modesAt(bg: Background, k: Vec2, weights = false): ModesAt {
  const A = dynamicalMatrix(bg, k);
  const n = A.n;
  let lam: { re: Float64Array; im: Float64Array };
  let vec: ((j: number) => { re: Float64Array; im: Float64Array }) | null = null;
  if (A.real) {
    const ev = realEigen(n, A.re);
    lam = ev;
    vec = ev.vec;
  } else {
    lam = complexEigenvalues(n, A.re, A.im);
  }
  let scale = 1;
  for (let j = 0; j < n; j++) scale = Math.max(scale, Math.hypot(lam.re[j], lam.im[j]));
  const tol = ZERO * scale;
  const out: { w: number; j: number }[] = [];
  let zeros: number[] = [];
  let growth = 0;
  for (let j = 0; j < n; j++) {
    if (lam.re[j] > tol) growth = Math.max(growth, lam.re[j]);
    if (lam.im[j] < -tol) out.push({ w: -lam.im[j], j });
    else if (Math.abs(lam.im[j]) <= tol) zeros.push(j);
  }
  // Zero modes: one branch per pair (a lone one rounds up).
  zeros = zeros.slice(0, Math.ceil(zeros.length / 2));
  for (const j of zeros) out.push({ w: 0, j });
  out.sort((a, b) => a.w - b.w);
  const res: ModesAt = { omega: out.map((o) => o.w), growth };
  if (weights && A.photon && vec) res.photonWeight = out.map((o) => photonWeight(bg, vec!(o.j), A.offset));
  return res;
}

/**
 * Photon weight of a mode at the zone centre: |da|^2 + |db|^2 against the emitter part
 * (1/M) sum_s (|u_s|^2 + |v_s|^2)/(4 r_s), the number of quanta per site in each (a spin
 * deviation dS_T of a Bloch vector of length r carries |dS_T|^2/(4r) excitations, as in the
 * Holstein-Primakoff expansion; the photon amplitude is per site, alpha = <a>/sqrt N). For the
 * normal state these are the Hopfield coefficients.
 */
export function photonWeight(bg: Background, w: { re: Float64Array; im: Float64Array }, off: number): number {
  const p = w.re[0] ** 2 + w.im[0] ** 2 + w.re[1] ** 2 + w.im[1] ** 2;
  let e = 0;
  for (let s = 0; s < bg.M; s++) {
    const u = off + 2 * s;
    const amp = w.re[u] ** 2 + w.im[u] ** 2 + w.re[u + 1] ** 2 + w.im[u + 1] ** 2;
    e += amp / (4 * Math.max(bg.r[s], 1e-12) * bg.M);
  }
  return p + e > 0 ? p / (p + e) : 0;
}
