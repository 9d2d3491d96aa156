/**
 * Linearised time-dependent mean-field equations about a stationary state (DESIGN.md,
 * "Fluctuations and soft modes"):
 *
 *   dS_i/dt = B_i x S_i,   B_i = (2 Re alpha, -2 Im alpha, xi_i),
 *   xi_i = -mu + sum_j V_ij (1 + S^z_j)/2,
 *   i dalpha/dt = (delta - mu) alpha + (1/2N) sum_i (S^x_i - i S^y_i).
 *
 * With S = S0 + dS, alpha = alpha0 + (da + i db) and dS = u e1 + v e2 (+ l n) in the frame
 * of background.ts, B0 = -2E n and S0 = r n give
 *
 *   du/dt =  2E v + r dB.e2,   dv/dt = -2E u - r dB.e1,   dl/dt = 0,
 *   dB_s = (2 da, -2 db, dxi_s),   dxi_s = (1/2) sum_t J_st(k) dS^z_t,
 *   d(da)/dt =  (delta-mu) db - (1/2M) sum_s dS^y_s,
 *   d(db)/dt = -(delta-mu) da - (1/2M) sum_s dS^x_s.
 *
 * For a Bloch wave dS_s(R) = dS_s(k) e^{ik.(R + r_s)} the couplings are J_st(k); the
 * photon takes part only at the zone centre (zone.ts), where the map is real. The
 * longitudinal amplitudes l are constants of the motion (d|S|^2/dt = 0), so the map acts
 * on the 2M transverse amplitudes (+ 2 photon): in the basis (transverse, longitudinal) it
 * is block triangular with a zero block, and its other eigenvalues are those of the
 * transverse block built here. Layout: [da, db] (if present), then (u_s, v_s) per s.
 */
import type { Vec2 } from '../lattice/geometry.ts';
import { type Background, backgroundCouplings } from './background.ts';
import { isZoneCentre } from './zone.ts';

export interface DynamicalMatrix {
  /** Dimension: 2M (+ 2 with the photon). */
  n: number;
  /** Row-major real and imaginary parts of d(x)/dt = A x. */
  re: Float64Array;
  im: Float64Array;
  /** Photon amplitudes at indices 0, 1. */
  photon: boolean;
  /** Index of u_0 (2 with the photon, else 0). */
  offset: number;
  /** A is real (zone centre, or real J(k)). */
  real: boolean;
}

/** The linear map of the fluctuations at crystal momentum k. */
export function dynamicalMatrix(bg: Background, k: Vec2): DynamicalMatrix {
  const M = bg.M;
  const centre = isZoneCentre(bg.l, bg.cell, k);
  const photon = bg.photon && centre;
  const off = photon ? 2 : 0;
  const n = 2 * M + off;
  const re = new Float64Array(n * n), im = new Float64Array(n * n);
  const J = backgroundCouplings(bg, centre ? [0, 0] : [k[0], k[1]]);
  const f = bg.frame;
  let real = true;
  for (let i = 0; i < J.im.length; i++) if (Math.abs(J.im[i]) > 1e-14 * (1 + Math.abs(J.re[i]))) { real = false; break; }
  for (let s = 0; s < M; s++) {
    const u = off + 2 * s, v = u + 1, r = bg.r[s], E = bg.E[s];
    const e1 = f.subarray(9 * s, 9 * s + 3), e2 = f.subarray(9 * s + 3, 9 * s + 6);
    re[u * n + v] += 2 * E;
    re[v * n + u] -= 2 * E;
    if (photon) {
      // dB.e = 2 da e_x - 2 db e_y
      re[u * n + 0] += 2 * r * e2[0];
      re[u * n + 1] -= 2 * r * e2[1];
      re[v * n + 0] -= 2 * r * e1[0];
      re[v * n + 1] += 2 * r * e1[1];
      // photon rows: -(1/2M) dS^y_s and -(1/2M) dS^x_s with dS = u e1 + v e2
      re[0 * n + u] -= e1[1] / (2 * M);
      re[0 * n + v] -= e2[1] / (2 * M);
      re[1 * n + u] -= e1[0] / (2 * M);
      re[1 * n + v] -= e2[0] / (2 * M);
    }
    // dxi_s = (1/2) sum_t J_st (u_t e1z_t + v_t e2z_t); row u gets r e2z_s dxi_s, row v gets -r e1z_s dxi_s.
    const cu = r * e2[2] / 2, cv = -r * e1[2] / 2;
    if (cu === 0 && cv === 0) continue;
    for (let t = 0; t < M; t++) {
      const jr = J.re[s * M + t], ji = J.im[s * M + t];
      const z1 = f[9 * t + 2], z2 = f[9 * t + 5];
      const ut = off + 2 * t, vt = ut + 1;
      re[u * n + ut] += cu * jr * z1; im[u * n + ut] += cu * ji * z1;
      re[u * n + vt] += cu * jr * z2; im[u * n + vt] += cu * ji * z2;
      re[v * n + ut] += cv * jr * z1; im[v * n + ut] += cv * ji * z1;
      re[v * n + vt] += cv * jr * z2; im[v * n + vt] += cv * ji * z2;
    }
  }
  if (photon) {
    re[0 * n + 1] += bg.dmu;
    re[1 * n + 0] -= bg.dmu;
  }
  return { n, re, im, photon, offset: off, real: real || centre };
}
