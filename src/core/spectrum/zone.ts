/**
 * Crystal momentum in the zone of a supercell. With superlattice vectors A_i and
 * reciprocal superlattice vectors B_j (A_i . B_j = 2 pi delta_ij), a wavevector is
 *
 *   k = f1 B1 + f2 B2,   f_i = k . A_i / (2 pi)   (fractional coordinates),
 *
 * and the Bloch sums obey J_st(k + G) = e^{iG.r_t} J_st(k) e^{-iG.r_s} for every
 * reciprocal superlattice vector G, a diagonal unitary change of basis: the spectrum and
 * the stability matrix are periodic in f with period 1. k and -k have the same spectrum
 * (the site-space matrices are real), so a zone grid needs only half the zone. The photon
 * couples to the sublattice-uniform amplitude, present exactly when k is a reciprocal
 * superlattice vector ("the zone centre", k = 0 of the supercell's zone).
 */
import type { Lattice, Vec2 } from '../lattice/geometry.ts';
import { type Supercell, reciprocalSuperlattice, superlatticeVectors } from '../lattice/supercells.ts';

/** Fractional coordinates (f1, f2) of k in the reciprocal superlattice basis (1D: f2 = 0). */
export function fractional(l: Lattice, cell: Supercell, k: Vec2): [number, number] {
  const [A1, A2] = superlatticeVectors(l, cell);
  const f1 = (k[0] * A1[0] + k[1] * A1[1]) / (2 * Math.PI);
  const f2 = l.dim === 1 ? 0 : (k[0] * A2[0] + k[1] * A2[1]) / (2 * Math.PI);
  return [f1, f2];
}

/** k = f1 B1 + f2 B2. */
export function fromFractional(l: Lattice, cell: Supercell, f: readonly [number, number]): [number, number] {
  const [B1, B2] = reciprocalSuperlattice(l, cell);
  if (l.dim === 1) return [f[0] * B1[0], 0];
  return [f[0] * B1[0] + f[1] * B2[0], f[0] * B1[1] + f[1] * B2[1]];
}

/** Fractional coordinates closer than this to integers count as the zone centre. */
const CENTRE_TOL = 1e-9;

/** Is k a reciprocal superlattice vector (k = 0 of the supercell's zone)? */
export function isZoneCentre(l: Lattice, cell: Supercell, k: Vec2): boolean {
  const [f1, f2] = fractional(l, cell, k);
  return Math.abs(f1 - Math.round(f1)) < CENTRE_TOL && Math.abs(f2 - Math.round(f2)) < CENTRE_TOL;
}

/**
 * The representative of k in the first Brillouin zone of the supercell (the shortest
 * k - G), with k -> -k used to fix a sign: 1D returns |k| in [0, pi/M]; 2D the shortest
 * vector equivalent to k or -k, ties broken as below.
 */
export function reduceToZone(l: Lattice, cell: Supercell, k: Vec2): [number, number] {
  const [B1, B2] = reciprocalSuperlattice(l, cell);
  if (l.dim === 1) {
    const g = B1[0];
    const x = k[0] - Math.round(k[0] / g) * g;
    return [Math.abs(x), 0];
  }
  // Gauss-reduce the reciprocal basis so a small search around the rounded point finds
  // the shortest vector of the coset even for skewed supercells.
  let [u, v] = [[B1[0], B1[1]], [B2[0], B2[1]]];
  for (let it = 0; it < 100; it++) {
    if (u[0] * u[0] + u[1] * u[1] > v[0] * v[0] + v[1] * v[1]) [u, v] = [v, u];
    const mu = Math.round((u[0] * v[0] + u[1] * v[1]) / (u[0] * u[0] + u[1] * u[1]));
    if (mu === 0) break;
    v = [v[0] - mu * u[0], v[1] - mu * u[1]];
  }
  const det = u[0] * v[1] - u[1] * v[0];
  const c1 = Math.round((k[0] * v[1] - k[1] * v[0]) / det);
  const c2 = Math.round((u[0] * k[1] - u[1] * k[0]) / det);
  // Shortest representatives of k and of -k (same spectrum); ties (zone corners) go to the
  // smallest |ky|, then the largest kx, then the largest ky: K as (4pi/3, 0), M as (pi, pi).
  const cands: [number, number][] = [];
  for (const sg of [1, -1]) {
    for (let i = -2; i <= 2; i++) {
      for (let j = -2; j <= 2; j++) {
        cands.push([sg * k[0] - (sg * c1 + i) * u[0] - (sg * c2 + j) * v[0], sg * k[1] - (sg * c1 + i) * u[1] - (sg * c2 + j) * v[1]]);
      }
    }
  }
  const n2 = (q: [number, number]) => q[0] * q[0] + q[1] * q[1];
  const shortest = Math.min(...cands.map(n2));
  const tie = 1e-9 * Math.max(shortest, 1e-300);
  const clean = (x: number) => (Math.abs(x) < 1e-12 ? 0 : x);
  const best = cands.filter((q) => n2(q) <= shortest + tie).map((q) => [clean(q[0]), clean(q[1])] as [number, number])
    .sort((a, b) => Math.abs(a[1]) - Math.abs(b[1]) || b[0] - a[0] || b[1] - a[1]);
  return best[0];
}

/** A wavevector as the CLI and the page print it: a number in 1D, [kx, ky] in 2D. */
export function kOut(l: Lattice, k: Vec2): number | [number, number] {
  return l.dim === 1 ? k[0] : [k[0], k[1]];
}
