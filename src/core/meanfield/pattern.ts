/**
 * Sublattice patterns and their translations. A pattern v_s on the M sublattices of a
 * supercell S is invariant under the lattice translation by the point (i_u, j_u) of
 * sublattice u when v_{s+u} = v_s for all s. The invariant translations together with the
 * superlattice form the pattern's own (primitive) superlattice L' of index M' = M / #inv;
 * its Hermite normal form [[a', b'], [0, c']] has a' = least i > 0 with (i, 0) in L',
 * c' = least j > 0 with some (i, j) in L', b' = that i mod a'. A 12-site 1D solution of
 * period 3 so reduces to the period-3 cell and its three densities.
 */
import { type Supercell, supercell, sublatticeOf } from '../lattice/supercells.ts';

const permCache = new Map<string, Int32Array[]>();

/** perm[u][s] = sublattice of (site s) + (site u), for every u = 0..M-1. */
export function translations(cell: Supercell): Int32Array[] {
  const key = `${cell.a},${cell.b},${cell.c}`;
  const hit = permCache.get(key);
  if (hit) return hit;
  const { M, sites } = cell;
  const out: Int32Array[] = [];
  for (let u = 0; u < M; u++) {
    const p = new Int32Array(M);
    for (let s = 0; s < M; s++) p[s] = sublatticeOf(cell, sites[2 * s] + sites[2 * u], sites[2 * s + 1] + sites[2 * u + 1]);
    out.push(p);
  }
  permCache.set(key, out);
  return out;
}

/** True when v (each of `arrays`) is unchanged, within tol, by the translation perm. */
function invariant(arrays: ArrayLike<number>[], perm: Int32Array, tol: number): boolean {
  for (const v of arrays) {
    for (let s = 0; s < perm.length; s++) if (Math.abs(v[perm[s]] - v[s]) > tol) return false;
  }
  return true;
}

/** Whether the pattern(s) have no smaller period than the cell (no invariant u != 0). */
export function isPrimitive(cell: Supercell, arrays: ArrayLike<number>[], tol = 0): boolean {
  const perms = translations(cell);
  for (let u = 1; u < cell.M; u++) if (invariant(arrays, perms[u], tol)) return false;
  return true;
}

/** Whether pattern y is pattern x translated (within tol). */
export function sameUpToTranslation(cell: Supercell, x: ArrayLike<number>, y: ArrayLike<number>, tol: number): boolean {
  for (const p of translations(cell)) {
    let ok = true;
    for (let s = 0; s < p.length && ok; s++) ok = Math.abs(x[p[s]] - y[s]) <= tol;
    if (ok) return true;
  }
  return false;
}

/**
 * The primitive cell of the pattern(s) and their values on it (v'_s' = v at the site of s').
 * Translations count as symmetries when every array is unchanged within tol.
 */
export function reduceToPrimitive(cell: Supercell, arrays: ArrayLike<number>[], tol: number): { cell: Supercell; arrays: number[][] } {
  const perms = translations(cell);
  const inv = new Uint8Array(cell.M);
  let count = 0;
  for (let u = 0; u < cell.M; u++) if (u === 0 || invariant(arrays, perms[u], tol)) { inv[u] = 1; count++; }
  const same = () => ({ cell, arrays: arrays.map((v) => Array.from(v)) });
  if (count === 1) return same();
  const inL = (i: number, j: number) => inv[sublatticeOf(cell, i, j)] === 1;
  let a = 1;
  while (!inL(a, 0)) a++;
  let c = 1, b = 0;
  outer: for (; c <= cell.c; c++) {
    for (let i = 0; i < a; i++) if (inL(i, c)) { b = i; break outer; }
  }
  if (a * c * count !== cell.M) return same(); // tolerance made the symmetry set inconsistent
  const red = supercell(a, b, c);
  const out = arrays.map((v) => {
    const r: number[] = [];
    for (let s = 0; s < red.M; s++) r.push(v[sublatticeOf(cell, red.sites[2 * s], red.sites[2 * s + 1])]);
    return r;
  });
  return { cell: red, arrays: out };
}
