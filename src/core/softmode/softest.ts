/**
 * The softest mode of a state: the minimum over the zone of the lowest eigenvalue of the
 * stability matrix (lowest-mode.ts), its wavevector k*, its kind and the margin
 * (the minimum itself: 1 for free emitters and photon, > 0 stable, 0 on a soft-mode line,
 * < 0 thermodynamically unstable).
 *
 * Zone grid in fractional coordinates of the reciprocal superlattice (zone.ts), half the
 * zone by k -> -k: 1D f = j/(2N), j = 0..N; 2D (i/N, j/N), i = 0..N/2, j = 0..N-1, with
 * N = 48 (1D) or 24 (2D) for one sublattice and half that for larger cells (their zone is
 * M times smaller). N is a multiple of 12, so the commensurate points with denominators
 * 2, 3, 4, 6, 12 (X, M, K, ...) lie on the grid, where the minima of lattice sums usually
 * are. The three lowest grid minima are refined by compass search (steps halved from half
 * the grid spacing down to 1e-7 in f). The zone centre, where the photon joins, is a point
 * of its own; the refinement stays off it.
 */
import type { Vec2 } from '../lattice/geometry.ts';
import type { Background } from '../spectrum/background.ts';
import { fromFractional, isZoneCentre, kOut, reduceToZone } from '../spectrum/zone.ts';
import { type SoftKind, lowestMode } from './lowest-mode.ts';
import { InputError } from '../input-error.ts';
import { ConvergenceError } from '../convergence-error.ts';

/** Grid divisions taken (the 2D grid costs N^2/2 diagonalisations). */
export const MAX_ZONE_GRID = 480;
/** Smallest refinement step taken: 1e-12 in f, a thousand times the rounding of f ~ 1. */
export const MIN_F_TOL = 1e-12;
/**
 * Compass-search evaluations per start: each halving of h takes at most ~2 dim moves before
 * the next (a move lowers the value, and the grid spacing bounds the moves at one h), so
 * 40 halvings (h from 1/96 to 1e-12) need far fewer.
 */
const MAX_COMPASS = 20000;

export interface SoftMode {
  /** k* reduced to the supercell's zone: a number in 1D, [kx, ky] in 2D. */
  k: number | [number, number];
  /** Lowest eigenvalue of the stability matrix over the zone. */
  margin: number;
  kind: SoftKind;
  /** margin > -STABLE_TOL. */
  stable: boolean;
}

/** Rounding allowance of `stable` (exact zero modes come out at ~1e-12). */
export const STABLE_TOL = 1e-9;

export interface SoftestOptions {
  /** Grid divisions N (see above; rounded up to a multiple of 12). */
  grid?: number;
  /** Smallest refinement step in f (default 1e-7). */
  fTol?: number;
}

/** The softest mode of bg over its zone. */
export function softestMode(bg: Background, o: SoftestOptions = {}): SoftMode & { evaluations: number } {
  const dim = bg.l.dim;
  if (o.grid !== undefined && !(o.grid >= 1 && o.grid <= MAX_ZONE_GRID)) {
    throw new InputError(`zone grid must be 1..${MAX_ZONE_GRID}, got ${o.grid}`, 'zone-grid');
  }
  if (o.fTol !== undefined && !(o.fTol >= MIN_F_TOL && o.fTol < 1)) {
    throw new InputError(`zone refinement step must be in [${MIN_F_TOL}, 1), got ${o.fTol}`, 'zone-tol');
  }
  const N0 = o.grid ?? (dim === 1 ? 48 : 24) / (bg.M > 1 ? 2 : 1);
  const N = Math.max(12, Math.ceil(N0 / 12) * 12);
  let evaluations = 0;
  const at = (f: [number, number]) => {
    evaluations++;
    return lowestMode(bg, fromFractional(bg.l, bg.cell, f));
  };
  const samples: { f: [number, number]; v: number; kind: SoftKind }[] = [];
  if (dim === 1) {
    for (let j = 0; j <= N; j++) { const f: [number, number] = [j / (2 * N), 0]; const m = at(f); samples.push({ f, v: m.value, kind: m.kind }); }
  } else {
    for (let i = 0; i <= N / 2; i++) {
      for (let j = 0; j < N; j++) { const f: [number, number] = [i / N, j / N]; const m = at(f); samples.push({ f, v: m.value, kind: m.kind }); }
    }
  }
  let best = samples.reduce((x, y) => (y.v < x.v ? y : x));
  const h0 = 1 / (2 * N) / (dim === 1 ? 2 : 1);
  const fTol = o.fTol ?? 1e-7;
  const starts = samples
    .filter((s) => !isZoneCentre(bg.l, bg.cell, fromFractional(bg.l, bg.cell, s.f)))
    .sort((x, y) => x.v - y.v).slice(0, 3);
  for (const s0 of starts) {
    let cur = { ...s0 }, h = h0, tries = 0;
    const dirs: [number, number][] = dim === 1 ? [[1, 0], [-1, 0]] : [[1, 0], [-1, 0], [0, 1], [0, -1]];
    while (h >= fTol) {
      if (++tries > MAX_COMPASS) throw new ConvergenceError('softest mode', `compass search not settled after ${MAX_COMPASS} steps`);
      let moved = false;
      for (const d of dirs) {
        const f: [number, number] = [cur.f[0] + h * d[0], cur.f[1] + h * d[1]];
        if (isZoneCentre(bg.l, bg.cell, fromFractional(bg.l, bg.cell, f))) continue;
        const m = at(f);
        if (m.value < cur.v) { cur = { f, v: m.value, kind: m.kind }; moved = true; break; }
      }
      if (!moved) h /= 2;
    }
    if (cur.v < best.v) best = cur;
  }
  const k = reduceToZone(bg.l, bg.cell, fromFractional(bg.l, bg.cell, best.f));
  return { k: kOut(bg.l, k), margin: best.v, kind: best.kind, stable: best.v > -STABLE_TOL, evaluations };
}

/** The lowest eigenvalue of the stability matrix at each k of a list (e.g. the zone path). */
export function marginsAt(bg: Background, ks: readonly Vec2[]): number[] {
  return ks.map((k) => lowestMode(bg, k).value);
}
