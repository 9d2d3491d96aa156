/**
 * Which blockade regime a planned array is in: the number of lattice sites inside the
 * blockade radius of one excited emitter (0 < r < Rb, r in lattice spacings). Inside that
 * disc V(r) > 2g, so a second excitation costs more than the vacuum Rabi splitting: the
 * nearest-neighbour blockade starts at Rb/a = 1, and every further shell that enters the
 * disc pushes the densest crystal to a lower filling (1/2, 1/3, ... in 1D).
 */
import { type LatticeName, lattice, position } from '../lattice/geometry.ts';

/** Number of lattice points with 0 < |r| < rb (rb in lattice spacings). */
export function sitesInsideBlockade(name: LatticeName, rb: number): number {
  const l = lattice(name);
  const n = Math.ceil(rb / (l.dim === 1 ? 1 : Math.sqrt(l.cellVolume))) + 2;
  let count = 0;
  for (let i = -n; i <= n; i++) {
    for (let j = l.dim === 1 ? 0 : -n; j <= (l.dim === 1 ? 0 : n); j++) {
      if (i === 0 && j === 0) continue;
      const [x, y] = position(l, i, j);
      if (Math.hypot(x, y) < rb) count++;
    }
  }
  return count;
}

/** The shells (distinct neighbour distances) inside the blockade radius, nearest first. */
export function shellsInsideBlockade(name: LatticeName, rb: number): number[] {
  const l = lattice(name);
  const n = Math.ceil(rb) + 2;
  const d = new Set<number>();
  for (let i = -n; i <= n; i++) {
    for (let j = l.dim === 1 ? 0 : -n; j <= (l.dim === 1 ? 0 : n); j++) {
      if (i === 0 && j === 0) continue;
      const [x, y] = position(l, i, j);
      const r = Math.hypot(x, y);
      if (r < rb) d.add(Math.round(r * 1e9) / 1e9);
    }
  }
  return [...d].sort((a, b) => a - b);
}
