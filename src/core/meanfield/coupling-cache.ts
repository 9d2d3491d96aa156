/**
 * J_st(0) of a supercell, cached. The mean-field solver needs the k = 0 lattice sums of
 * every cell up to Mmax at every point of a scan; they depend on the point only through
 * the interaction. Power laws V = C / r^s and the softcore V0 / (1 + (r/Rc)^6) are linear
 * in their strength (C = V1 or 2 Rb^s; V0), so the sums are computed once at unit strength
 * per (lattice, shape, range, cell[, Rc]) and scaled: a map over Rb or V1 computes each
 * cell's sums once. The nn shape (a direct sum of two shells) is keyed by V1, V2.
 * The cache is a bounded least-recently-used map (plain memoisation: results are
 * identical with or without it).
 */
import type { Lattice } from '../lattice/geometry.ts';
import type { Supercell } from '../lattice/supercells.ts';
import type { InteractionSpec, Potential } from '../interaction/potential.ts';
import { unitStrength } from '../interaction/unit-strength.ts';
import { couplings } from '../interaction/lattice-sums.ts';

const LIMIT = 4096;
const cache = new Map<string, Float64Array>();

/**
 * J_st(0) = sum_R V(|r_t - r_s + R|) (r = 0 left out) of `cell`, row-major M x M, real
 * (Hermitian and real at k = 0: symmetric). Do not modify the returned array.
 */
export function cellCouplings(l: Lattice, spec: InteractionSpec, pot: Potential, cell: Supercell): Float64Array {
  const { key, unit, scale } = unitStrength(l, spec, pot);
  const full = `${key}|${cell.a},${cell.b},${cell.c}|${scale}`;
  const hit = cache.get(full);
  if (hit) { cache.delete(full); cache.set(full, hit); return hit; }
  const unitKey = `${key}|${cell.a},${cell.b},${cell.c}|unit`;
  let base = cache.get(unitKey);
  if (!base) {
    base = couplings(l, cell, unit).re;
    put(unitKey, base);
  }
  if (scale === 1) return base;
  const J = new Float64Array(base.length);
  for (let i = 0; i < J.length; i++) J[i] = scale * base[i];
  put(full, J);
  return J;
}

function put(key: string, J: Float64Array): void {
  cache.set(key, J);
  while (cache.size > LIMIT) cache.delete(cache.keys().next().value as string);
}
