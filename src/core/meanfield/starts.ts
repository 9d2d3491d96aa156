/**
 * Starting states of the self-consistency in one supercell (DESIGN.md: the solver must not
 * stop at a metastable solution). For a cell of M sublattices:
 *   - M = 1: the uniform states m = 0 (empty), 1/2 and 1 (filled);
 *   - M > 1: the classical ground state of each filling p/M whose pattern has no smaller
 *     period (patterns of a smaller period are starts of that smaller cell): by brute force
 *     over all 2^M patterns with J_st(0) for M <= 12 (classical.ts), and in 1D also the
 *     generalised Wigner lattice of every p/M with gcd(p, M) = 1 (the only source for
 *     M > 12);
 *   - seeded random states m_s uniform in [0, 1] (the seedrandom generator of stream
 *     `seed|cell|k`, drawn by arc4-uniforms.ts), so
 *     results are fixed by the seed.
 * Duplicate patterns (equal up to a translation) are dropped. The continuation guess is
 * added by the caller, as one start among these. The integer starts depend on the point
 * only through J (not on mu, delta or T), so they are cached per J array: along a scan row
 * at fixed interaction they are built once (plain memoisation: the same starts either way).
 */
import { gcd } from './phase.ts';
import { arc4Uniforms } from '../numerics/arc4-uniforms.ts';
import type { Supercell } from '../lattice/supercells.ts';
import { BRUTE_FORCE_LIMIT, classicalMinima, wignerLattice } from './classical.ts';
import { isPrimitive, sameUpToTranslation } from './pattern.ts';

/** A named start: where it came from (for diagnostics) and the m_s. */
export interface Start {
  kind: 'uniform' | 'classical' | 'wigner' | 'random' | 'guess';
  m: Float64Array;
}

export interface StartOptions {
  dim: 1 | 2;
  /** Seed of the random starts. */
  seed: number;
  /** Random starts per cell with M > 1 (default 1). */
  randomStarts?: number;
}

/** Integer starts per J array (J arrays come from the coupling cache, one per cell and interaction). */
const integerCache = new WeakMap<Float64Array, Map<string, Start[]>>();

/**
 * The classical and Wigner starts of a cell with M > 1 (deduplicated, primitive), cached per
 * (J, cell, dim). The returned list and its m arrays are shared: callers must not modify them.
 */
function integerStarts(cell: Supercell, J: Float64Array, dim: 1 | 2): Start[] {
  const key = `${dim}|${cell.a},${cell.b},${cell.c}`;
  let byCell = integerCache.get(J);
  const hit = byCell?.get(key);
  if (hit) return hit;
  const M = cell.M;
  const out: Start[] = [];
  const add = (kind: Start['kind'], n: Uint8Array) => {
    if (!isPrimitive(cell, [n])) return;
    for (const s of out) if (sameUpToTranslation(cell, s.m, n, 0)) return;
    out.push({ kind, m: Float64Array.from(n) });
  };
  if (M <= BRUTE_FORCE_LIMIT) {
    const minima = classicalMinima(J, M);
    for (let p = 1; p < M; p++) add('classical', minima[p]);
  }
  if (dim === 1) {
    for (let p = 1; p < M; p++) if (gcd(p, M) === 1) add('wigner', wignerLattice(p, M));
  }
  if (!byCell) integerCache.set(J, byCell = new Map());
  byCell.set(key, out);
  return out;
}

/**
 * The deterministic (uniform, classical, Wigner) and seeded random starts of one cell, in
 * that order. A fresh list (the caller may add to it); the m arrays must not be modified.
 */
export function cellStarts(cell: Supercell, J: Float64Array, o: StartOptions): Start[] {
  const M = cell.M;
  if (M === 1) {
    return [0, 0.5, 1].map((v) => ({ kind: 'uniform' as const, m: Float64Array.of(v) }));
  }
  const out: Start[] = integerStarts(cell, J, o.dim).slice();
  const nr = o.randomStarts ?? 1;
  for (let k = 0; k < nr; k++) {
    // the first M draws of seedrandom(`seed|cell|k`), without building that generator
    out.push({ kind: 'random', m: arc4Uniforms(`${o.seed}|${cell.a},${cell.b},${cell.c}|${k}`, new Float64Array(M)) });
  }
  return out;
}
