/**
 * A finite cluster of emitters: N sites, their pair couplings V_ij and pair distances,
 * the distance shells used by C(r) and the Jastrow factor, and the momenta on which the
 * structure factor is reported.
 *
 * Periodic clusters (a ring or torus of the lattice) take V_ij summed over every periodic
 * image of j and d_ij the minimum-image distance; a user's array has open boundaries and
 * plain Euclidean distances. Lengths in units of the lattice spacing a, energies in g.
 */
import type { LatticeName } from '../lattice/geometry.ts';

/** Largest cluster accepted: dense N x N pair tables (V, d, shell) cost ~20 N^2 bytes. */
export const MAX_CLUSTER_SITES = 1024;

export interface Cluster {
  /** 'periodic': ring or torus of the lattice; 'array': the user's sites, open boundaries. */
  readonly kind: 'periodic' | 'array';
  readonly lattice: LatticeName;
  readonly N: number;
  /** Periodic clusters: Lx x Ly primitive cells (Ly = 1 for the chain). */
  readonly Lx: number;
  readonly Ly: number;
  /** Position of site i at [2i], [2i+1] (units of a). */
  readonly positions: Float64Array;
  /** V_ij row-major at [i*N + j], symmetric, diagonal zero. */
  readonly V: Float64Array;
  /** Pair distance d_ij (minimum image on periodic clusters), diagonal zero. */
  readonly distance: Float64Array;
  /** Distinct pair distances, ascending. */
  readonly shells: Float64Array;
  /** Shell index of the pair (i, j) at [i*N + j]; -1 on the diagonal. */
  readonly shellOf: Int32Array;
  /** Momenta (kx, ky) at [2q], [2q+1] for the structure factor. */
  readonly momenta: Float64Array;
  /** Integer label (m1, m2) of momentum q: k = m1 B1 + m2 B2 (periodic) or the grid index (array). */
  readonly momentumLabels: Int32Array;
}

/** Distances closer than this (relative to the largest) are one shell. */
const SHELL_TOLERANCE = 1e-9;

/**
 * Group the pair distances into shells: sort the distinct values and merge neighbours
 * closer than 1e-9 of the largest distance (rounding of the positions, not physics).
 */
export function distanceShells(N: number, distance: Float64Array): { shells: Float64Array; shellOf: Int32Array } {
  const values: number[] = [];
  for (let i = 0; i < N; i++) for (let j = i + 1; j < N; j++) values.push(distance[i * N + j]);
  values.sort((a, b) => a - b);
  const tol = SHELL_TOLERANCE * Math.max(1, values.length ? values[values.length - 1] : 1);
  const shells: number[] = [];
  for (const d of values) if (!shells.length || d - shells[shells.length - 1] > tol) shells.push(d);
  const shellOf = new Int32Array(N * N).fill(-1);
  for (let i = 0; i < N; i++) {
    for (let j = 0; j < N; j++) {
      if (i === j) continue;
      shellOf[i * N + j] = nearestShell(shells, distance[i * N + j]);
    }
  }
  return { shells: Float64Array.from(shells), shellOf };
}

/** Index of the shell closest to d (binary search in the ascending list). */
function nearestShell(shells: number[], d: number): number {
  let lo = 0, hi = shells.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (shells[mid] <= d) lo = mid; else hi = mid;
  }
  return Math.abs(shells[hi] - d) < Math.abs(shells[lo] - d) ? hi : lo;
}

/** Number of ordered pairs (i, j), i != j, in each shell. */
export function shellPairCounts(c: Cluster): Float64Array {
  const counts = new Float64Array(c.shells.length);
  for (let p = 0; p < c.N * c.N; p++) if (c.shellOf[p] >= 0) counts[c.shellOf[p]]++;
  return counts;
}
