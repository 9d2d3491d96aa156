/**
 * A crystal of a map: a solved state that is a fixed trial state of the grand potential,
 * an integer occupation pattern n_s in {0, 1} on a supercell with alpha = 0 at T = 0.
 * Its Omega per site,
 *
 *   Omega_n = (1/M) sum_s [xi_s/2 - |xi_s|/2] - (1/(2M)) sum_s n_s (xi_s + mu),
 *   xi_s = -mu + sum_t J_st(0) n_t,
 *
 * is affine in mu, delta (absent) and the interaction strength (J scales with V1, or with
 * Rb^6 for vdw), which is what certifies a map region (docs/certified-maps.md). Two crystals
 * are the same when their cells' Hermite normal forms agree and their patterns are equal up
 * to a lattice translation; `key` names the class (the cell and the smallest translate).
 */
import type { SolveResult } from '../meanfield/ground-state.ts';
import { supercell } from '../lattice/supercells.ts';
import { translations } from '../meanfield/pattern.ts';

export interface Crystal {
  cell: { a: number; b: number; c: number };
  /** n_s on the reported (primitive) cell, exactly 0 or 1. */
  n: number[];
  /** `a,b,c:bits` of the lexicographically smallest translate: equal keys, same crystal. */
  key: string;
}

/** Densities within this of 0 or 1 (with alpha = 0, T = 0) are the integer pattern. */
export const INTEGER_TOL = 1e-9;

/** The crystal a state is, or null (condensate, T > 0, fixed density with coexistence, non-integer m). */
export function crystalOf(s: SolveResult | undefined): Crystal | null {
  if (!s || s.T !== 0 || s.alpha !== 0 || s.coexistence) return null;
  const n: number[] = [];
  for (const m of s.sublatticeDensities) {
    if (Math.abs(m) <= INTEGER_TOL) n.push(0);
    else if (Math.abs(m - 1) <= INTEGER_TOL) n.push(1);
    else return null;
  }
  return { cell: { ...s.cell }, n, key: crystalKey(s.cell, n) };
}

/** The class key of pattern n on cell (a, b, c): the smallest of its translates. */
export function crystalKey(cell: { a: number; b: number; c: number }, n: ArrayLike<number>): string {
  const sc = supercell(cell.a, cell.b, cell.c);
  let best = '';
  for (const p of translations(sc)) {
    let t = '';
    for (let s = 0; s < p.length; s++) t += n[p[s]] ? '1' : '0';
    if (best === '' || t < best) best = t;
  }
  return `${cell.a},${cell.b},${cell.c}:${best}`;
}

/** Whether two states are the same crystal (both crystals, same class). */
export function sameCrystal(x: SolveResult | undefined, y: SolveResult | undefined): boolean {
  const a = crystalOf(x), b = crystalOf(y);
  return a !== null && b !== null && a.key === b.key;
}
