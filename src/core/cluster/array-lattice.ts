/**
 * Which Bravais lattice of spacing a a user's array is cut from, if any: the lattice whose
 * mean-field answer it may be compared with. A site set lies on
 *
 *   chain:       one line y = y0 with x - x0 integer,
 *   square:      x - x0 and y - y0 integers,
 *   triangular:  j = (y - y0) / (sqrt3/2) and i = (x - x0) - j/2 integers,
 *
 * (x0, y0 the first site), each to 1e-6 a. The preferred lattice (the model's) is taken
 * when the array fits it; otherwise the first that fits in the order chain, square,
 * triangular; null when none does (an array that is no lattice of spacing a).
 */
import type { LatticeName } from '../lattice/geometry.ts';

const TOL = 1e-6;

const near = (v: number) => Math.abs(v - Math.round(v)) < TOL;

/** Does every site of positions [x0, y0, x1, y1, ...] lie on the lattice? */
export function fitsLattice(name: LatticeName, positions: readonly number[]): boolean {
  const x0 = positions[0], y0 = positions[1];
  for (let s = 0; s < positions.length; s += 2) {
    const dx = positions[s] - x0, dy = positions[s + 1] - y0;
    if (name === 'chain' && !(Math.abs(dy) < TOL && near(dx))) return false;
    if (name === 'square' && !(near(dx) && near(dy))) return false;
    if (name === 'triangular') {
      const j = dy / (Math.sqrt(3) / 2);
      if (!(near(j) && near(dx - Math.round(j) / 2))) return false;
    }
  }
  return true;
}

/** The lattice the array is cut from (the preferred one when it fits), or null. */
export function arrayLattice(positions: readonly number[], preferred?: LatticeName): LatticeName | null {
  if (positions.length < 2) return null;
  if (preferred && fitsLattice(preferred, positions)) return preferred;
  for (const name of ['chain', 'square', 'triangular'] as const) if (fitsLattice(name, positions)) return name;
  return null;
}
