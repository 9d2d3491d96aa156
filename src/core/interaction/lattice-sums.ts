/**
 * Converged lattice sums of the interaction between the sublattices of a supercell:
 *
 *   J_st(k) = sum_{R in superlattice} V(|r_t - r_s + R|) exp(i k.(r_t - r_s + R)),  r = 0 left out.
 *
 * Stored row-major, J[s*M + t], as real and imaginary parts; J is Hermitian.
 *
 * Finite range (nn shape or rmax set): the direct sum. Full-range power laws C/r^s: the
 * Ewald split r^-s = [Gamma(s/2, eta^2 r^2) + gamma(s/2, eta^2 r^2)] / (Gamma(s/2) r^s),
 * the short part summed in real space and the long part by Poisson summation over the
 * reciprocal superlattice, with
 *   h_long^(p) = pi^{d/2}/Gamma(s/2) (p/2)^{s-d} Gamma((d-s)/2, p^2/(4 eta^2))
 *   h_long^(0) = pi^{d/2}/Gamma(s/2) eta^{s-d} / ((s-d)/2),   h_long(0) = eta^s/((s/2) Gamma(s/2))
 * (P. P. Ewald, Ann. Phys. 64, 253 (1921); the incomplete-gamma form for r^-s is standard,
 * e.g. Crandall, Experimental Math. 8, 367 (1999)). Both parts converge like exp(-x^2), so the
 * result is exact to rounding (~1e-14 relative). Softcore on the chain with Rc >= 1: Poisson
 * summation with the closed-form transform (softcore-poisson.ts), stable at any Rc. Softcore
 * otherwise: V0 Rc^6 times the r^-6 Ewald sum plus the direct sum of
 * V - V0 Rc^6/r^6 = -V0 Rc^12/(r^6 (r^6 + Rc^6)), whose neglected tail beyond 15 Rc (1D) or
 * 10 Rc (2D) is below (1/15)^11 or (1/10)^10 of the result; the two parts are ~Rc^{6-d} times the result, so rounding
 * costs eps Rc^{6-d} relative (< 1e-12 for Rc < 1 in 1D and < 1e-10 for Rc <= MAX_SOFTCORE_RC_2D = 20
 * in 2D, where potential.ts refuses larger Rc).
 */
import { type Lattice, type Vec2, position } from '../lattice/geometry.ts';
import {
  type Supercell, reciprocalSuperlattice, sitePosition, sublatticeOf, superlatticeVectors, period, supercell,
} from '../lattice/supercells.ts';
import type { Potential } from './potential.ts';
import { gammaHalfInteger, upperGamma } from '../numerics/incomplete-gamma.ts';
import { POISSON_MIN_RC, softcorePoissonChain } from './softcore-poisson.ts';

export interface CouplingMatrix {
  readonly M: number;
  /** Re J_st at [s*M + t]. */
  readonly re: Float64Array;
  /** Im J_st at [s*M + t]. */
  readonly im: Float64Array;
}

/** Exponent of exp(-x) below which Ewald terms are dropped (e^-50 ~ 2e-22). */
const EWALD_CUT = 50;

/** J_st(k) for every pair of sublattices of `cell`. k defaults to 0. */
export function couplings(l: Lattice, cell: Supercell, pot: Potential, k: Vec2 = [0, 0]): CouplingMatrix {
  const M = cell.M;
  const J: CouplingMatrix = { M, re: new Float64Array(M * M), im: new Float64Array(M * M) };
  if (Number.isFinite(pot.rmax)) {
    directSum(l, cell, (r) => (r > pot.rmax + 1e-9 ? 0 : pot.V(r)), pot.rmax, k, J);
  } else if (pot.powerLaw) {
    ewaldSum(l, cell, pot.powerLaw.s, pot.powerLaw.C, k, J);
  } else if (pot.softcore && pot.softcore.V0 === 0) {
    // V = 0: nothing to sum.
  } else if (pot.softcore && l.dim === 1 && pot.softcore.Rc >= POISSON_MIN_RC) {
    softcorePoissonChain(M, pot.softcore.V0, pot.softcore.Rc, k[0], J);
  } else if (pot.softcore) {
    const { V0, Rc } = pot.softcore;
    const Rc6 = Math.pow(Rc, 6);
    ewaldSum(l, cell, 6, V0 * Rc6, k, J);
    const rest = (r: number) => { const r6 = Math.pow(r, 6); return (-V0 * Rc6 * Rc6) / (r6 * (r6 + Rc6)); };
    directSum(l, cell, rest, Math.max((l.dim === 1 ? 15 : 10) * Rc, 10), k, J);
  } else {
    throw new Error(`no lattice sum for ${pot.shape} without a range`);
  }
  return J;
}

/** The lattice Fourier transform V(k) = sum_{r != 0} V(r) cos(k.r) of the whole lattice (M = 1). */
export function fourierV(l: Lattice, pot: Potential, k: Vec2): number {
  const cell = l.dim === 1 ? period(1) : supercell(1, 0, 1);
  return couplings(l, cell, pot, k).re[0];
}

/** Add sum over lattice points 0 < |r| <= R of v(|r|) e^{ik.r} into J, coset by coset. */
function directSum(l: Lattice, cell: Supercell, v: (r: number) => number, R: number, k: Vec2, J: CouplingMatrix): void {
  const M = cell.M;
  const ni = Math.ceil((R * Math.hypot(l.b1[0], l.b1[1])) / (2 * Math.PI)) + 1;
  const nj = l.dim === 1 ? 0 : Math.ceil((R * Math.hypot(l.b2[0], l.b2[1])) / (2 * Math.PI)) + 1;
  for (let j = -nj; j <= nj; j++) {
    for (let i = -ni; i <= ni; i++) {
      if (i === 0 && j === 0) continue;
      const [x, y] = position(l, i, j);
      const r = Math.hypot(x, y);
      if (r > R + 1e-9) continue;
      const val = v(r);
      if (val === 0) continue;
      const ph = k[0] * x + k[1] * y;
      const c = val * Math.cos(ph), s = val * Math.sin(ph);
      for (let a = 0; a < M; a++) {
        const b = sublatticeOf(cell, cell.sites[2 * a] + i, cell.sites[2 * a + 1] + j);
        J.re[a * M + b] += c;
        J.im[a * M + b] += s;
      }
    }
  }
}

/** Add C * (Ewald sum of r^-s) into J. */
function ewaldSum(l: Lattice, cell: Supercell, s: number, C: number, k: Vec2, J: CouplingMatrix): void {
  const M = cell.M, d = l.dim;
  const [A1, A2] = superlatticeVectors(l, cell);
  const [B1, B2] = reciprocalSuperlattice(l, cell);
  const vol = M * l.cellVolume;
  const eta = Math.sqrt(Math.PI) / Math.pow(vol, 1 / d);
  const gs = gammaHalfInteger(s / 2);
  const rc = Math.sqrt(EWALD_CUT) / eta;
  const pc = 2 * eta * Math.sqrt(EWALD_CUT);
  const kn = Math.hypot(k[0], k[1]);
  const norm = (v: readonly number[]) => Math.hypot(v[0], v[1]);
  // Reciprocal-space terms depend on s, t only through the phase e^{-iG.d}: tabulate G first.
  const Gs: { gx: number; gy: number; w: number }[] = [];
  const m1 = Math.ceil(((pc + kn) * norm(A1)) / (2 * Math.PI)) + 1;
  const m2 = d === 1 ? 0 : Math.ceil(((pc + kn) * norm(A2)) / (2 * Math.PI)) + 1;
  const pref = Math.pow(Math.PI, d / 2) / gs / vol;
  for (let b = -m2; b <= m2; b++) {
    for (let a = -m1; a <= m1; a++) {
      const gx = a * B1[0] + b * B2[0], gy = a * B1[1] + b * B2[1];
      const p = Math.hypot(k[0] + gx, k[1] + gy);
      const x = (p * p) / (4 * eta * eta);
      if (x > EWALD_CUT) continue;
      const hp = p < 1e-14
        ? Math.pow(eta, s - d) / ((s - d) / 2)
        : Math.pow(p / 2, s - d) * upperGamma((d - s) / 2, x);
      Gs.push({ gx, gy, w: pref * hp });
    }
  }
  const n1 = Math.ceil((rc * norm(B1)) / (2 * Math.PI)) + 2;
  const n2 = d === 1 ? 0 : Math.ceil((rc * norm(B2)) / (2 * Math.PI)) + 2;
  const self = Math.pow(eta, s) / ((s / 2) * gs);
  for (let sa = 0; sa < M; sa++) {
    const [xs, ys] = sitePosition(l, cell, sa);
    for (let tb = 0; tb < M; tb++) {
      const [xt, yt] = sitePosition(l, cell, tb);
      const dx = xt - xs, dy = yt - ys;
      let re = 0, im = 0;
      for (let b = -n2; b <= n2; b++) {
        for (let a = -n1; a <= n1; a++) {
          const x = dx + a * A1[0] + b * A2[0], y = dy + a * A1[1] + b * A2[1];
          const r2 = x * x + y * y;
          if (r2 < 1e-20) { re -= self; continue; }
          const z = eta * eta * r2;
          if (z > EWALD_CUT) continue;
          const h = upperGamma(s / 2, z) / (gs * Math.pow(r2, s / 2));
          const ph = k[0] * x + k[1] * y;
          re += h * Math.cos(ph); im += h * Math.sin(ph);
        }
      }
      for (const G of Gs) {
        const ph = -(G.gx * dx + G.gy * dy);
        re += G.w * Math.cos(ph); im += G.w * Math.sin(ph);
      }
      J.re[sa * M + tb] += C * re;
      J.im[sa * M + tb] += C * im;
    }
  }
}
