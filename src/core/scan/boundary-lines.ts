/**
 * Confirming crystal boundaries with few solves (docs/certified-maps.md, "Boundaries").
 *
 * On a map whose axes are affine (affine-axes.ts) a crystal's Omega is an affine function
 * of the normalised affine coordinates s = (s_x, s_y) in [0, 1]^2 of the map, so
 *
 *   - it is known everywhere from three evaluations (CrystalModels), and
 *   - the set where two crystals A, B tie, Omega_A = Omega_B, is a straight line.
 *
 * A crossing of A|B is confirmed when a solve there finds no state below Omega_A (= Omega_B).
 * Two confirmed points c1, c2 on the A|B line confirm the whole segment between them:
 * g = Omega* - Omega_A is concave (a minimum of affine functions minus an affine one),
 * g <= 0 everywhere and g = 0 at c1 and c2, so g = 0 on [c1, c2]. The confirmed part of a
 * line is therefore one interval (the superlevel set {g >= -eps} of a concave function is
 * convex), and BoundaryLines keeps it, in a parameter t along the line, across the bands
 * of a map: a crossing inside it needs no solve.
 *
 * A crossing where a crystal R already met lies below both A and B (closed form, the same
 * tolerance as a confirming solve) is not confirmable: it is split at R without a solve
 * (lowerCrystal). Both shortcuts change no pixel; they only decide which crossings need a
 * confirming solve.
 */
import type { ModelParams } from '../model.ts';
import { affineCoordinate } from './affine-axes.ts';
import { applyAxis, type Axis } from './axes.ts';
import { crystalOmega } from './boundaries.ts';
import type { Crystal } from './crystal.ts';
import type { ScanPlan } from './grid.ts';

/** Relative tolerance of a confirmation: a state lower by more than this refutes it. */
export const CONFIRM_TOL = 1e-9;

/** Most crystals kept as candidates for lowerCrystal (a map meets a few dozen). */
export const MAX_KNOWN_CRYSTALS = 256;

/** The lower one of two Omega values less the confirmation tolerance. */
export function confirmFloor(omega: number): number {
  return omega - CONFIRM_TOL * Math.max(1, Math.abs(omega));
}

/** One axis of the frame: its affine coordinate at the first and last value. */
interface FrameAxis { axis: Axis; u0: number; u1: number }

/**
 * The map's normalised affine coordinates: s = (u - u_first) / (u_last - u_first) per axis
 * (0 for an axis of one value). null when an axis is not affine.
 */
export class AffineFrame {
  private constructor(readonly base: ModelParams, private readonly axes: FrameAxis[]) {}

  static of(plan: ScanPlan): AffineFrame | null {
    const axes: FrameAxis[] = [];
    for (const axis of plan.y ? [plan.x, plan.y] : [plan.x]) {
      const u0 = affineCoordinate(axis.name, axis.values[0], plan.base);
      const u1 = affineCoordinate(axis.name, axis.values[axis.values.length - 1], plan.base);
      if (u0 === null || u1 === null) return null;
      axes.push({ axis, u0, u1 });
    }
    return new AffineFrame(plan.base, axes);
  }

  get dims(): number {
    return this.axes.length;
  }

  /** s of a point given by its axis values ([x] or [x, y]). */
  coords(point: readonly number[]): number[] {
    return this.axes.map((a, k) => {
      const u = affineCoordinate(a.axis.name, point[k], this.base) as number;
      return a.u1 === a.u0 ? 0 : (u - a.u0) / (a.u1 - a.u0);
    });
  }

  /** The parameters at the corner where axis k (or none, k = -1) is at its last value and the others at their first. */
  corner(k: number): ModelParams {
    let p = this.base;
    this.axes.forEach((a, i) => {
      p = applyAxis(p, a.axis.name, i === k ? a.axis.values[a.axis.values.length - 1] : a.axis.values[0]);
    });
    return p;
  }
}

/** Omega of a crystal as an affine function of s: value at s = 0 and one slope per axis. */
export interface AffineOmega { c0: number; slope: number[] }

/** Affine models of crystals' Omega over one map, computed once per crystal class. */
export class CrystalModels {
  private readonly cache = new Map<string, AffineOmega>();
  constructor(readonly frame: AffineFrame) {}

  model(c: Crystal): AffineOmega {
    let m = this.cache.get(c.key);
    if (!m) {
      const c0 = crystalOmega(this.frame.corner(-1), c);
      const slope: number[] = [];
      for (let k = 0; k < this.frame.dims; k++) slope.push(crystalOmega(this.frame.corner(k), c) - c0);
      m = { c0, slope };
      this.cache.set(c.key, m);
    }
    return m;
  }

  /** Omega of crystal c at normalised coordinates s. */
  omega(c: Crystal, s: readonly number[]): number {
    const m = this.model(c);
    let v = m.c0;
    for (let k = 0; k < s.length; k++) v += m.slope[k] * s[k];
    return v;
  }
}

/**
 * The lowest of `known` (other than A and B) lying below `omega` (the tie value of A and B
 * at s) by more than the confirmation tolerance, or null.
 */
export function lowerCrystal(models: CrystalModels, known: Iterable<Crystal>, s: readonly number[], omega: number, exclude: readonly string[]): Crystal | null {
  const floor = confirmFloor(omega);
  let best: Crystal | null = null, bestOmega = floor;
  for (const r of known) {
    if (exclude.includes(r.key)) continue;
    const w = models.omega(r, s);
    if (w < bestOmega) { best = r; bestOmega = w; }
  }
  return best;
}

/** Key of the line where two crystals tie (order-free). */
export function lineKey(a: Crystal, b: Crystal): string {
  return a.key < b.key ? `${a.key}|${b.key}` : `${b.key}|${a.key}`;
}

/**
 * The confirmed interval of each tie line, in a parameter t along the line: t = s . d with
 * d perpendicular to the gradient of Omega_A - Omega_B (so t orders the points of the line;
 * on a one-axis map t = s_x).
 */
export class BoundaryLines {
  private readonly confirmed = new Map<string, { lo: number; hi: number }>();
  constructor(readonly models: CrystalModels) {}

  /** The parameter of point s on the A|B line. */
  param(a: Crystal, b: Crystal, s: readonly number[]): number {
    if (s.length === 1) return s[0];
    const [x, y] = a.key < b.key ? [a, b] : [b, a];
    const mx = this.models.model(x), my = this.models.model(y);
    const gx = mx.slope[0] - my.slope[0], gy = mx.slope[1] - my.slope[1];
    const norm = Math.hypot(gx, gy) || 1;
    return (-gy * s[0] + gx * s[1]) / norm;
  }

  /** Whether t lies in the confirmed interval of the line (to rounding). */
  covers(key: string, t: number): boolean {
    const c = this.confirmed.get(key);
    if (!c) return false;
    const eps = 1e-12 * Math.max(1, Math.abs(t));
    return t >= c.lo - eps && t <= c.hi + eps;
  }

  /** The interval of the line, or undefined when nothing on it is confirmed yet. */
  interval(key: string): { lo: number; hi: number } | undefined {
    const c = this.confirmed.get(key);
    return c ? { ...c } : undefined;
  }

  /** Record a confirmed point: the interval grows to the hull of what it held and t. */
  confirm(key: string, t: number): void {
    const c = this.confirmed.get(key);
    if (!c) this.confirmed.set(key, { lo: t, hi: t });
    else { c.lo = Math.min(c.lo, t); c.hi = Math.max(c.hi, t); }
  }
}

/**
 * Which of a line's unresolved crossings (their parameters ts) to solve next: with no
 * confirmed interval, the median; otherwise the farthest on each side of the interval
 * (confirmed, it confirms its whole side; refuted, its lower crystal usually refutes the
 * rest of that side through lowerCrystal). Returns indices into ts.
 */
export function probes(ts: readonly number[], interval: { lo: number; hi: number } | undefined): number[] {
  if (!ts.length) return [];
  const order = ts.map((_, i) => i).sort((i, j) => ts[i] - ts[j]);
  if (!interval) return [order[Math.floor(order.length / 2)]];
  const out: number[] = [];
  const first = order[0], last = order[order.length - 1];
  if (ts[first] < interval.lo) out.push(first);
  if (ts[last] > interval.hi && !out.includes(last)) out.push(last);
  return out;
}
