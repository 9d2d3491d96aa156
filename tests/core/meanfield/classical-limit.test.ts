/**
 * Classical limit of the sublattice mean-field: a 1D vdw chain, V(r) = 2 Rb^6 / r^6 with
 * Rb = 1.5, T = 0 and the photon detuned far above (delta = 1e9), so alpha = 0 on every
 * plateau and the model is the classical lattice gas  e = -mu rho + (1/2N) sum V_ij n_i n_j.
 *
 * Independent reference computed here: brute force over every periodic occupation pattern
 * of period q <= Mmax (2^q patterns each), with couplings J^(q)_st = sum_n V(|t - s + n q|)
 * summed directly out to |r| = 1e4 (tail < 1e-20 relative, r^-6). For each fraction the
 * lowest interaction energy per site u(rho); the staircase is the lower convex hull of the
 * points (rho, u): a vertex's plateau is mu in [left slope, right slope].
 *
 * Bak-Bruinsma widths (SOURCES.bakBruinsma): dmu(p/q) = q sum_n n [V(nq+1) + V(nq-1) - 2V(nq)]
 * for the infinite chain. Leaving out periods above Mmax can only widen a plateau: the
 * staircase is complete, so between the true edge of p/q and that of its Farey neighbour
 * r/s in F_Mmax (the next fraction the truncated search knows) lie only the plateaus of the
 * fractions strictly between them, all with denominators > Mmax; the truncated search
 * shares that interval between p/q and r/s. Hence
 *     dmu_BB(p/q) <= width_Mmax(p/q) <= dmu_BB(p/q) + gap_left + gap_right,
 * with gap = sum of dmu_BB over the fractions between p/q and the neighbour (summed here for
 * denominators up to 3000; the rest is below 1e-22 since dmu_BB(q) ~ q^-7 and there are
 * fewer than q of them per q).
 */
import { describe, expect, it } from 'vitest';
import { solveGroundState } from '../../../src/core/meanfield/ground-state.ts';
import { findPlateaus, refinePlateaus } from '../../../src/core/meanfield/plateaus.ts';
import { wignerLattice } from '../../../src/core/meanfield/classical.ts';
import type { ModelParams } from '../../../src/core/model.ts';
import { SOURCES } from '../../references.ts';

const Rb = 1.5, C = 2 * Rb ** 6, Mmax = 12, delta = 1e9;
const V = (r: number) => C / r ** 6;
const model = (mu: number): ModelParams => ({
  lattice: 'chain', interaction: { shape: 'vdw', Rb }, delta, T: 0, mu, maxCell: Mmax,
});
const gcd = (a: number, b: number): number => (b ? gcd(b, a % b) : a);

function directCouplings(q: number): Float64Array {
  const J = new Float64Array(q * q), N = Math.ceil(1e4 / q);
  for (let s = 0; s < q; s++) {
    for (let t = 0; t < q; t++) {
      let sum = 0;
      for (let n = -N; n <= N; n++) { const r = Math.abs(t - s + n * q); if (r) sum += V(r); }
      J[s * q + t] = sum;
    }
  }
  return J;
}

interface Vertex { p: number; q: number; rho: number; u: number; pattern: number[]; lo: number; hi: number }

/** Lower convex hull of the brute-force (rho, u) points: the truncated classical staircase. */
function bruteForceStaircase(): Vertex[] {
  const best = new Map<string, Vertex>();
  for (let q = 1; q <= Mmax; q++) {
    const J = directCouplings(q);
    for (let mask = 0; mask < 1 << q; mask++) {
      const n: number[] = [];
      let occ = 0, u = 0;
      for (let s = 0; s < q; s++) { n.push((mask >> s) & 1); occ += n[s]; }
      for (let s = 0; s < q; s++) if (n[s]) for (let t = 0; t < q; t++) if (n[t]) u += J[s * q + t];
      u /= 2 * q;
      const g = gcd(occ, q) || q;
      const key = `${occ / g}/${q / g}`;
      const b = best.get(key);
      if (!b || u < b.u - 1e-15 * Math.abs(u)) best.set(key, { p: occ / g, q: q / g, rho: occ / q, u, pattern: n, lo: 0, hi: 0 });
    }
  }
  const pts = [...best.values()].sort((a, b) => a.rho - b.rho);
  const hull: Vertex[] = [];
  for (const v of pts) {
    while (hull.length >= 2) {
      const a = hull[hull.length - 2], b = hull[hull.length - 1];
      if ((b.u - a.u) * (v.rho - a.rho) >= (v.u - a.u) * (b.rho - a.rho)) hull.pop(); else break;
    }
    hull.push(v);
  }
  hull.forEach((v, i) => {
    v.lo = i > 0 ? (v.u - hull[i - 1].u) / (v.rho - hull[i - 1].rho) : -Infinity;
    v.hi = i < hull.length - 1 ? (hull[i + 1].u - v.u) / (hull[i + 1].rho - v.rho) : Infinity;
  });
  return hull;
}

const bbCache = new Map<number, number>();
/**
 * dmu(p/q) of Bak and Bruinsma (depends on q only); the n-sum is cut at n = 400, where the
 * terms (~ n^-7 relative to the first) are below 1e-18 of the sum.
 */
function bakBruinsma(q: number): number {
  const hit = bbCache.get(q);
  if (hit !== undefined) return hit;
  let s = 0;
  for (let n = 1; n <= 400; n++) s += n * (V(n * q + 1) + V(n * q - 1) - 2 * V(n * q));
  bbCache.set(q, q * s);
  return q * s;
}

/** Sum of dmu_BB over fractions strictly between x and y with denominators Mmax < b <= bMax. */
function missingWidth(x: number, y: number, bMax = 3000): number {
  const [lo, hi] = x < y ? [x, y] : [y, x];
  let s = 0;
  for (let b = Mmax + 1; b <= bMax; b++) {
    const w = bakBruinsma(b);
    for (let a = Math.floor(lo * b) + 1; a < hi * b; a++) if (gcd(a, b) === 1) s += w;
  }
  return s;
}

/** Whether the densities are the pattern n translated (0/1 to within 1e-12). */
function isTranslate(m: number[], n: ArrayLike<number>): boolean {
  const q = n.length;
  if (m.length !== q) return false;
  for (let k = 0; k < q; k++) {
    let ok = true;
    for (let s = 0; s < q && ok; s++) ok = Math.abs(m[s] - n[(s + k) % q]) < 1e-12;
    if (ok) return true;
  }
  return false;
}

const hull = bruteForceStaircase();

describe('classical limit, vdw chain', () => {
  it('the brute-force staircase holds every fraction with q <= Mmax (complete staircase)', () => {
    // Every reduced p/q with q <= 12 is a hull vertex: 1 + sum_{q<=12} phi(q) = 47 (SOURCES.bakBruinsma).
    let count = 1;
    for (let q = 1; q <= Mmax; q++) for (let p = 1; p <= q; p++) if (gcd(p, q) === 1) count++;
    expect(hull.length, SOURCES.bakBruinsma).toBe(count);
  });

  it('mid-plateau: fraction equals the brute force and the state is the generalised Wigner lattice', () => {
    for (const v of hull.slice(1, -1)) {
      const s = solveGroundState(model((v.lo + v.hi) / 2));
      const f = `${v.p}/${v.q}`;
      expect(s.fraction, `brute force ${f}`).toBe(f);
      expect(s.phase).toBe('density-wave');
      expect(s.photonDensity).toBe(0);
      expect(s.cellSize).toBe(v.q);
      // SOURCES.wignerLattice: sites floor(j q / p); the brute-force minimum is the same pattern.
      expect(isTranslate(s.sublatticeDensities, wignerLattice(v.p, v.q)), `${f} Wigner (${SOURCES.wignerLattice})`).toBe(true);
      expect(isTranslate(s.sublatticeDensities, v.pattern), `${f} brute-force pattern`).toBe(true);
    }
  });

  it('widths of 1/2, 1/3, 1/4: solver = brute force, and Bak-Bruinsma within the truncation excess', () => {
    for (const q of [2, 3, 4]) {
      const i = hull.findIndex((v) => v.p === 1 && v.q === q);
      const v = hull[i], left = hull[i - 1], right = hull[i + 1];
      const hullWidth = v.hi - v.lo;
      // Solver: grid points just outside and at the middle, edges bisected to 1e-10.
      const w = 1e-3 * hullWidth;
      const pts = [v.lo - w, (v.lo + v.hi) / 2, v.hi + w].map((mu) => solveGroundState(model(mu)));
      const found = refinePlateaus(findPlateaus(pts, Mmax), pts, Mmax, (mu) => solveGroundState(model(mu)), 1e-10)
        .find((p) => p.fraction === `1/${q}`);
      expect(found).toBeDefined();
      // Tolerance: 2e-10 from the bisection, plus the photon: it lowers any state's energy
      // by at most 1/(4(delta - mu)) per site (alpha eliminated, |mean sigma^x| <= 1), which
      // moves an edge between plateaus whose densities differ by >= 1/Mmax^2 by at most
      // Mmax^2/(4(delta - mu)) ~ 3.6e-8 here.
      const photonShift = (Mmax * Mmax) / (4 * (delta - v.hi));
      expect(Math.abs(found!.width - hullWidth)).toBeLessThanOrEqual(2e-10 + 2 * photonShift);
      // Bak-Bruinsma bound (derived in the header).
      const bb = bakBruinsma(q);
      const excess = missingWidth(left.rho, v.rho) + missingWidth(v.rho, right.rho);
      // Measured (Rb = 1.5): width - BB = 1.2e-5, 9.6e-6, 8.9e-6 against bounds 5.4e-5, 3.5e-5,
      // 2.7e-5 for 1/2, 1/3, 1/4; solver and brute force agree to < 1e-9.
      expect(hullWidth, SOURCES.bakBruinsma).toBeGreaterThanOrEqual(bb * (1 - 1e-12));
      expect(hullWidth - bb, SOURCES.bakBruinsma).toBeLessThanOrEqual(excess * (1 + 1e-9) + 1e-14);
      expect(found!.width, SOURCES.bakBruinsma).toBeGreaterThanOrEqual(bb - 2e-10 - 2 * photonShift);
      expect(found!.width - bb, SOURCES.bakBruinsma).toBeLessThanOrEqual(excess + 2e-10 + 2 * photonShift);
    }
  });
});
