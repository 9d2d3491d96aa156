/**
 * J_st(k) of a supercell at any crystal momentum (src/core/interaction/lattice-sums.ts),
 * cached. Zone grids, their refinement and soft-line tracing ask for the same k of the
 * same cell again and again while only the strength or (mu, delta, T) changes. Power laws
 * C/r^s and the softcore V0/(1 + (r/Rc)^6) are linear in C and V0, so the sums are kept
 * at unit strength per (lattice, shape, range, [Rc,] cell, k) and scaled; the nn shape is
 * keyed by V1, V2. A bounded least-recently-used map: plain memoisation, results are the
 * same with or without it.
 */
import type { Lattice, Vec2 } from '../lattice/geometry.ts';
import type { Supercell } from '../lattice/supercells.ts';
import type { InteractionSpec, Potential } from '../interaction/potential.ts';
import { unitStrength } from '../interaction/unit-strength.ts';
import { type CouplingMatrix, couplings } from '../interaction/lattice-sums.ts';

const LIMIT = 20000;
const cache = new Map<string, CouplingMatrix>();

/**
 * J_st(k) of `cell` (row-major re/im, Hermitian). The returned arrays are fresh copies
 * scaled to the strength of `spec`; callers may modify them.
 */
export function blochCouplings(l: Lattice, spec: InteractionSpec, pot: Potential, cell: Supercell, k: Vec2): CouplingMatrix {
  const { key, unit, scale } = unitStrength(l, spec, pot);
  const full = `${key}|${cell.a},${cell.b},${cell.c}|${k[0].toPrecision(15)},${k[1].toPrecision(15)}`;
  let base = cache.get(full);
  if (base) {
    cache.delete(full);
  } else {
    base = couplings(l, cell, unit, k);
  }
  cache.set(full, base);
  while (cache.size > LIMIT) cache.delete(cache.keys().next().value as string);
  const re = new Float64Array(base.re.length), im = new Float64Array(base.im.length);
  for (let i = 0; i < re.length; i++) { re[i] = scale * base.re[i]; im[i] = scale * base.im[i]; }
  return { M: base.M, re, im };
}
