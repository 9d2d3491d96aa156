/**
 * Supercells (sublattice patterns) by Hermite normal form.
 *
 * A supercell is an integer matrix S = [[a, b], [0, c]] whose columns (a, 0) and (b, c)
 * are the superlattice vectors in units of the primitive vectors, with a c = M and
 * 0 <= b < a. Every sublattice of Z^2 of index M has exactly one basis of this form, so
 * enumerating them gives every periodic pattern with M sublattices exactly once
 * (sigma(M) = sum of divisors of M of them). In 1D the cell is the period M: [[M, 0], [0, 1]].
 *
 * The M sublattices are the integer points (i, j) with 0 <= i < a, 0 <= j < c, indexed
 * s = j a + i.
 */
import { type Lattice, position } from './geometry.ts';

export interface Supercell {
  /** Number of sublattices M = a c. */
  readonly M: number;
  readonly a: number;
  readonly b: number;
  readonly c: number;
  /** Integer coordinates (i, j) of sublattice s at [2s], [2s+1]. */
  readonly sites: Int32Array;
}

/** The supercell [[a, b], [0, c]]. */
export function supercell(a: number, b: number, c: number): Supercell {
  if (!(a >= 1 && c >= 1 && b >= 0 && b < a)) throw new Error(`not a Hermite normal form: ${a},${b},${c}`);
  const M = a * c;
  const sites = new Int32Array(2 * M);
  for (let j = 0; j < c; j++) {
    for (let i = 0; i < a; i++) {
      sites[2 * (j * a + i)] = i;
      sites[2 * (j * a + i) + 1] = j;
    }
  }
  return { M, a, b, c, sites };
}

/** The 1D cell of period M. */
export function period(M: number): Supercell {
  return supercell(M, 0, 1);
}

/** Every supercell with exactly M sublattices on a lattice of dimension `dim`. */
export function supercellsOfSize(dim: 1 | 2, M: number): Supercell[] {
  if (dim === 1) return [period(M)];
  const out: Supercell[] = [];
  for (let a = 1; a <= M; a++) {
    if (M % a !== 0) continue;
    for (let b = 0; b < a; b++) out.push(supercell(a, b, M / a));
  }
  return out;
}

/** Every supercell with 1 <= M <= Mmax sublattices, smallest first. */
export function supercellsUpTo(dim: 1 | 2, Mmax: number): Supercell[] {
  const out: Supercell[] = [];
  for (let M = 1; M <= Mmax; M++) out.push(...supercellsOfSize(dim, M));
  return out;
}

/** Sublattice index of the integer lattice point (i, j): reduce modulo the superlattice. */
export function sublatticeOf(cell: Supercell, i: number, j: number): number {
  const jj = ((j % cell.c) + cell.c) % cell.c;
  const shift = (j - jj) / cell.c;
  const ii = (((i - shift * cell.b) % cell.a) + cell.a) % cell.a;
  return jj * cell.a + ii;
}

/** Superlattice vectors A1, A2 in Cartesian coordinates (A2 unused in 1D). */
export function superlatticeVectors(l: Lattice, cell: Supercell): [[number, number], [number, number]] {
  return [position(l, cell.a, 0), position(l, cell.b, cell.c)];
}

/** Cartesian position of sublattice s inside the cell. */
export function sitePosition(l: Lattice, cell: Supercell, s: number): [number, number] {
  return position(l, cell.sites[2 * s], cell.sites[2 * s + 1]);
}

/** Reciprocal superlattice vectors B1, B2 with A_i . B_j = 2 pi delta_ij. */
export function reciprocalSuperlattice(l: Lattice, cell: Supercell): [[number, number], [number, number]] {
  const [A1, A2] = superlatticeVectors(l, cell);
  if (l.dim === 1) return [[2 * Math.PI / A1[0], 0], [0, 2 * Math.PI]];
  const det = A1[0] * A2[1] - A1[1] * A2[0];
  const f = 2 * Math.PI / det;
  return [[f * A2[1], -f * A2[0]], [-f * A1[1], f * A1[0]]];
}
