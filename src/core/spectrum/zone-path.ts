/**
 * The path through the primitive Brillouin zone along which branches are shown:
 *
 *   chain:       0 -> pi
 *   square:      Gamma (0,0) -> X (pi,0) -> M (pi,pi) -> Gamma
 *   triangular:  Gamma (0,0) -> M (pi, pi/sqrt3) -> K (4pi/3, 0) -> Gamma
 *
 * (lattice spacing 1; M and K of the triangular lattice are the edge midpoint and the
 * corner of its hexagonal zone). Points are spaced evenly in arc length with every corner
 * on the path; `s` is the arc length, for the horizontal axis of a band plot. A state of
 * M sublattices shows its bands folded into this primitive path (periodic in k with the
 * reciprocal superlattice), so a uniform state's branch reads unfolded.
 */
import { InputError } from '../input-error.ts';
import type { Lattice, Vec2 } from '../lattice/geometry.ts';

export interface ZonePath {
  /** The wavevectors, in order. */
  k: [number, number][];
  /** Arc length along the path at each point. */
  s: number[];
  /** The corners: label and arc length. */
  ticks: { label: string; s: number }[];
}

const S3 = Math.sqrt(3);

/** Corners of the path of a lattice, with labels. */
export function pathCorners(l: Lattice): { label: string; k: Vec2 }[] {
  switch (l.name) {
    case 'chain':
      return [{ label: '0', k: [0, 0] }, { label: 'pi', k: [Math.PI, 0] }];
    case 'square':
      return [
        { label: 'Gamma', k: [0, 0] }, { label: 'X', k: [Math.PI, 0] },
        { label: 'M', k: [Math.PI, Math.PI] }, { label: 'Gamma', k: [0, 0] },
      ];
    case 'triangular':
      return [
        { label: 'Gamma', k: [0, 0] }, { label: 'M', k: [Math.PI, Math.PI / S3] },
        { label: 'K', k: [(4 * Math.PI) / 3, 0] }, { label: 'Gamma', k: [0, 0] },
      ];
  }
}

/** Most points along the path (each is one eigenproblem of the linearised map). */
export const MAX_PATH_POINTS = 10000;

/** n >= 2 points along the path (corners included, so n grows to at least the corner count). */
export function zonePath(l: Lattice, n: number): ZonePath {
  if (!(Number.isInteger(n) && n >= 2 && n <= MAX_PATH_POINTS)) {
    throw new InputError(`points along the zone path must be an integer 2..${MAX_PATH_POINTS}, got ${n}`, 'points');
  }
  const corners = pathCorners(l);
  const legs = corners.length - 1;
  const len: number[] = [];
  for (let i = 0; i < legs; i++) {
    const [a, b] = [corners[i].k, corners[i + 1].k];
    len.push(Math.hypot(b[0] - a[0], b[1] - a[1]));
  }
  const total = len.reduce((x, y) => x + y, 0);
  const intervals = Math.max(legs, n - 1);
  // Intervals per leg proportional to its length, at least one each, summing to `intervals`.
  const per = len.map((L) => Math.max(1, Math.round((intervals * L) / total)));
  let excess = per.reduce((x, y) => x + y, 0) - intervals;
  while (excess !== 0) {
    const i = excess > 0 ? per.indexOf(Math.max(...per)) : per.indexOf(Math.min(...per));
    per[i] -= Math.sign(excess);
    excess -= Math.sign(excess);
  }
  const out: ZonePath = { k: [], s: [], ticks: [{ label: corners[0].label, s: 0 }] };
  let s0 = 0;
  for (let i = 0; i < legs; i++) {
    const [a, b] = [corners[i].k, corners[i + 1].k];
    for (let j = i === 0 ? 0 : 1; j <= per[i]; j++) {
      const t = j / per[i];
      out.k.push([a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])]);
      out.s.push(s0 + t * len[i]);
    }
    s0 += len[i];
    out.ticks.push({ label: corners[i + 1].label, s: s0 });
  }
  return out;
}
